import { createApp } from 'vue'
import { createPinia } from 'pinia'
// Only the weights the interface uses, shipped in the bundle (no font CDN).
import '@fontsource/ibm-plex-sans/400.css'
import '@fontsource/ibm-plex-sans/500.css'
import '@fontsource/ibm-plex-sans/600.css'
import './theme/base.css'
import App from './App.vue'
import { createAppRouter } from './router'
import { usePreferencesStore } from './stores/preferences'
import { loadNaiveDarkTheme } from './theme/naiveDark'

const app = createApp(App)
const pinia = createPinia()
app.use(pinia)
app.use(createAppRouter())
// In dark mode, the dark theme is there before the first paint (no flash of the light one).
const ready = usePreferencesStore(pinia).isDark ? loadNaiveDarkTheme() : Promise.resolve()
void ready.finally(() => app.mount('#app'))
