// A share link's address is shown once, when it is made (the server keeps only its hash). The
// browser that made it remembers it here, so that editor can still print its QR code later. A
// revoked link is forgotten here; an expired one is only ever looked up by a live id, so it is
// never shown again.

const storageKey = 'loudhour.share-urls.v1'

function readAll(): Record<string, string> {
  try {
    const parsed: unknown = JSON.parse(localStorage.getItem(storageKey) ?? '{}')
    return parsed && typeof parsed === 'object' ? (parsed as Record<string, string>) : {}
  } catch {
    return {}
  }
}

function writeAll(urls: Record<string, string>): void {
  try {
    localStorage.setItem(storageKey, JSON.stringify(urls))
  } catch {
    // Storage refused (private window): the address lasts while the page is open.
  }
}

export function rememberShareUrl(linkId: number, url: string): void {
  writeAll({ ...readAll(), [String(linkId)]: url })
}

/** The remembered addresses of these (live) links. */
export function knownShareUrls(liveIds: number[]): Map<number, string> {
  const all = readAll()
  return new Map(
    liveIds.flatMap((id) => (all[String(id)] ? [[id, all[String(id)]!] as [number, string]] : [])),
  )
}

export function forgetShareUrl(linkId: number): void {
  const all = readAll()
  delete all[String(linkId)]
  writeAll(all)
}

// Which link's QR code a plan's card shows, as chosen in this browser: it changes only when the
// user picks another link (or makes the first one), never because a link was e-mailed.
const qrStorageKey = 'loudhour.card-qr.v1'

function readChoices(): Record<string, number> {
  try {
    const parsed: unknown = JSON.parse(localStorage.getItem(qrStorageKey) ?? '{}')
    return parsed && typeof parsed === 'object' ? (parsed as Record<string, number>) : {}
  } catch {
    return {}
  }
}

/** The link chosen for the plan's QR code, or null when none was chosen here. */
export function chosenQrLink(planId: number): number | null {
  const chosen = readChoices()[String(planId)]
  return typeof chosen === 'number' ? chosen : null
}

export function chooseQrLink(planId: number, linkId: number): void {
  try {
    localStorage.setItem(qrStorageKey, JSON.stringify({ ...readChoices(), [planId]: linkId }))
  } catch {
    // Storage refused: the choice lasts while the page is open.
  }
}
