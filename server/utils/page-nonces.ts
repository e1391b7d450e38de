const TAG = /<(link|script|style)\b/gi
const QUOTED = /"(?:[^"\\]|\\.)*"/g
const PLACEHOLDER = '__QUOTE_PLACEHOLDER_'

/**
 * nuxt-security's nonce injection for one piece of a page: every quoted string is masked, each <link>, <script>
 * and <style> outside them gets the nonce right after its name (a <link> that has one gets it replaced), and the
 * quoted strings are put back.
 */
function nonceTags(html: string, nonce: string) {
  const quoted: string[] = []
  return html.replace(QUOTED, text => `${PLACEHOLDER}${quoted.push(text) - 1}__`)
    .replace(/<link\b([^>]*?>)/gi, (tag, rest: string) => /nonce="[^"]+"/i.test(rest) ? tag.replace(/nonce="[^"]+"/i, `nonce="${nonce}"`) : `<link nonce="${nonce}"${rest}`)
    .replace(/<script\b([^>]*?>)/gi, (_tag, rest: string) => `<script nonce="${nonce}"${rest}`)
    .replace(/<style\b([^>]*?>)/gi, (_tag, rest: string) => `<style nonce="${nonce}"${rest}`)
    .replace(/__QUOTE_PLACEHOLDER_(\d+)__/g, (_text, index: string) => quoted[Number(index)]!)
}

/** Where the quoted strings of `html` start and end, found in order as nonceTags' mask finds them. */
function quotedStrings(html: string) {
  const starts: number[] = []
  const ends: number[] = []
  for (const match of html.matchAll(QUOTED)) {
    starts.push(match.index)
    ends.push(match.index + match[0].length)
  }
  /** The quoted string holding `position`, as its index, or -1. */
  const holding = (position: number) => {
    let low = 0
    let high = starts.length - 1
    while (low <= high) {
      const middle = (low + high) >> 1
      if (starts[middle]! > position) high = middle - 1
      else if (ends[middle]! <= position) low = middle + 1
      else return middle
    }
    return -1
  }
  return { holding, endOf: (index: number) => ends[index]! }
}

/**
 * The same result as nonceTags, from where the tags are instead of rewriting the whole piece: each tag opening
 * outside quoted strings that is closed by a `>` outside them, and not inside the previous match of its kind,
 * gets the nonce. A piece that already names a nonce, or holds the mask's own placeholder text, goes through
 * nonceTags itself.
 */
export function withNonce(html: string, nonce: string) {
  if (html.includes(PLACEHOLDER)) return nonceTags(html, nonce)
  const tags = [...html.matchAll(TAG)]
  if (!tags.length) return html
  if (/nonce="/i.test(html)) return nonceTags(html, nonce)
  const quoted = quotedStrings(html)
  const closeAfter = (from: number): number => {
    const close = html.indexOf('>', from)
    const holder = close < 0 ? -1 : quoted.holding(close)
    return holder < 0 ? close : closeAfter(quoted.endOf(holder))
  }
  const matchedUpTo = new Map<string, number>()
  let result = ''
  let copied = 0
  for (const tag of tags) {
    const name = tag[1]!.toLowerCase()
    const nameEnd = tag.index + tag[0].length
    // Masked, a quoted string right after the name reads as a word character: no word boundary, no tag.
    if (quoted.holding(tag.index) >= 0 || quoted.holding(nameEnd) >= 0 || tag.index < (matchedUpTo.get(name) ?? 0)) continue
    const close = closeAfter(nameEnd)
    if (close < 0) continue
    matchedUpTo.set(name, close + 1)
    result += `${html.slice(copied, tag.index)}<${name} nonce="${nonce}"`
    copied = nameEnd
  }
  return result + html.slice(copied)
}
