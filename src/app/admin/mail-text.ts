/** A run of a mail's plain text: prose, or a web address to show as a link. */
export interface MailTextPart {
  readonly kind: 'text' | 'link';
  readonly value: string;
}

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
/** Punctuation that usually ends the sentence around an address rather than the address. */
const TRAILING = /[.,;:!?)\]]+$/;

/**
 * Splits a mail's text part into prose and web addresses, so the captured-mail reader can make
 * the invitation and reset links clickable without ever rendering the text as HTML.
 */
export function splitMailText(text: string): MailTextPart[] {
  const parts: MailTextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const url = match[0].replace(TRAILING, '');
    if (start > last) {
      parts.push({ kind: 'text', value: text.slice(last, start) });
    }
    parts.push({ kind: 'link', value: url });
    last = start + url.length;
  }
  if (last < text.length) {
    parts.push({ kind: 'text', value: text.slice(last) });
  }
  return parts;
}

/**
 * The HTML part wrapped for a sandboxed `srcdoc` frame: a Content-Security-Policy that blocks
 * every remote load (tracking pixels, fonts, scripts) and a base target that keeps links from
 * navigating the frame. The frame's empty `sandbox` attribute already stops scripts, forms,
 * pop-ups and same-origin access; this only adds privacy and tidiness on top.
 */
export function framedMailHtml(html: string): string {
  return (
    '<!doctype html><html><head><meta charset="utf-8">' +
    '<meta http-equiv="Content-Security-Policy" content="default-src \'none\'; img-src data:; style-src \'unsafe-inline\'">' +
    '<base target="_blank"></head><body>' +
    html +
    '</body></html>'
  );
}

/**
 * Whether the HTML part refers to inline attachments (`cid:` images, such as the digest's
 * chart). Captured mail keeps the text and HTML parts only, so the reader says why those
 * images show as their alt text.
 */
export function hasInlineImages(html: string): boolean {
  return /\bsrc\s*=\s*["']?cid:/i.test(html);
}
