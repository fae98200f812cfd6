/**
 * Puts text on the clipboard as rich text and plain text where the browser allows it, and
 * falls back to a hidden textarea where the Clipboard API is missing (plain http on a LAN).
 */
export async function copyRich(html: string, plain: string): Promise<boolean> {
  try {
    if (navigator.clipboard && typeof ClipboardItem !== 'undefined') {
      await navigator.clipboard.write([
        new ClipboardItem({ 'text/html': new Blob([html], { type: 'text/html' }), 'text/plain': new Blob([plain], { type: 'text/plain' }) }),
      ]);
      return true;
    }
    if (navigator.clipboard) {
      await navigator.clipboard.writeText(plain);
      return true;
    }
  } catch {
    // fall through to the old way
  }
  const area = document.createElement('textarea');
  area.value = plain;
  area.setAttribute('readonly', '');
  area.style.position = 'fixed';
  area.style.opacity = '0';
  document.body.appendChild(area);
  area.select();
  let ok = false;
  try {
    ok = document.execCommand('copy');
  } catch {
    ok = false;
  }
  area.remove();
  return ok;
}
