import { onBeforeUnmount, watchEffect, type Ref } from 'vue'
import { PAPER, type PaperSize } from '../components/card/paper'

/**
 * Sets the printed page's size and margins while the card view is open (`@page` cannot be
 * scoped to a component, so one <style> element is kept in the head and removed on leaving).
 */
export function usePrintPage(paper: Ref<PaperSize>): void {
  const style = document.createElement('style')
  style.dataset.cardPage = ''
  document.head.append(style)
  watchEffect(() => {
    const spec = PAPER[paper.value]
    style.textContent = `@page { size: ${spec.pageSize}; margin: ${spec.marginMm}mm; }`
  })
  onBeforeUnmount(() => style.remove())
}
