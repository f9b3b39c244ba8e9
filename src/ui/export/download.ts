/**
 * Files the page offers for download: made in the browser, handed over through an object URL
 * (blob:, which the page's Content-Security-Policy allows); nothing leaves the computer.
 */

/** Offers a blob as a file named `fileName`. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  link.hidden = true;
  document.body.append(link);
  link.click();
  link.remove();
  // Revoked on the next turn: the download has taken the URL by then.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

/** Bytes of base64 text (a PNG from the chart library). */
export function base64Bytes(base64: string): Uint8Array<ArrayBuffer> {
  const text = atob(base64.replace(/^data:[^,]*,/, ''));
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
  return bytes;
}

/** A file name from an id or title: lower case, words joined by hyphens, safe on every system. */
export function fileSlug(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9.]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return slug || 'sekundo';
}
