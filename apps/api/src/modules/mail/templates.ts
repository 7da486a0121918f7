import type { OutgoingMail } from './mailer';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A plain, readable message with one link; text and HTML parts say the same thing. */
export function linkMail(p: { to: string; subject: string; lines: string[]; linkLabel: string; url: string; footer?: string }): OutgoingMail {
  const text = [...p.lines, '', `${p.linkLabel}: ${p.url}`, '', p.footer ?? '— Splitcase'].join('\n');
  const html = `<div style="font-family:'IBM Plex Sans',Arial,sans-serif;color:#16191d;max-width:560px">
${p.lines.map((l) => `<p>${escape(l)}</p>`).join('\n')}
<p><a href="${escape(p.url)}" style="color:#a35a2c">${escape(p.linkLabel)}</a></p>
<p style="color:#6b6f76;font-size:13px">${escape(p.footer ?? '— Splitcase')}</p></div>`;
  return { to: p.to, subject: p.subject, text, html };
}
