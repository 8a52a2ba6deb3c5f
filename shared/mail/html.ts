/**
 * Plain HTML for e-mail: inline styles, no images, no scripts, no remote resources and no tracked links, so a
 * message looks the same in every mail program and reports nothing back to anyone.
 */

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export const mailStyles = {
  body: 'margin:0;padding:24px;background:#f6f4ef;font-family:Lexend,Verdana,Arial,sans-serif;color:#1d232b;line-height:1.5;',
  card: 'max-width:640px;margin:0 auto;background:#ffffff;border-radius:12px;padding:24px;',
  h1: 'font-size:22px;margin:0 0 12px;',
  h2: 'font-size:17px;margin:24px 0 8px;',
  p: 'margin:0 0 12px;',
  urgent: 'border:3px solid #a4291a;border-radius:8px;padding:12px 16px;margin:16px 0;background:#fff4f1;',
  note: 'border-left:4px solid #2f6f8f;padding:8px 12px;margin:16px 0;background:#f1f7fa;',
  small: 'font-size:13px;color:#4a5561;margin:16px 0 0;',
  button: 'display:inline-block;padding:12px 20px;border-radius:8px;background:#1d232b;color:#ffffff;text-decoration:none;font-weight:bold;',
  table: 'border-collapse:collapse;margin:0 0 12px;',
  cell: 'padding:6px 12px;border-bottom:1px solid #e3dfd6;text-align:left;',
} as const;

export function paragraph(text: string): string {
  return `<p style="${mailStyles.p}">${escapeHtml(text)}</p>`;
}

export function list(items: readonly string[]): string {
  return `<ul style="margin:0 0 12px;padding-left:20px;">${items.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`;
}

export function heading(text: string, level: 1 | 2 = 2): string {
  return `<h${level} style="${level === 1 ? mailStyles.h1 : mailStyles.h2}">${escapeHtml(text)}</h${level}>`;
}

/** A link shown as a button, with the address written out beneath it for mail programs that hide links. */
export function linkButton(label: string, href: string): string {
  const safe = escapeHtml(href);
  return `<p style="${mailStyles.p}"><a href="${safe}" style="${mailStyles.button}">${escapeHtml(label)}</a></p><p style="${mailStyles.small}">Or open this address: ${safe}</p>`;
}

export function mailDocument(title: string, inner: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(
    title,
  )}</title></head><body style="${mailStyles.body}"><div style="${mailStyles.card}">${inner}</div></body></html>`;
}
