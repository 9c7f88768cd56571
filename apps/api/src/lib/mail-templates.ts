/** Our own plain, warm mail look: ink on paper, a wood-brown rule, the shop's name. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function layout(shop: string, heading: string, paragraphs: string[], action?: { label: string; url: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px;line-height:1.5">${esc(p)}</p>`).join('');
  const button = action
    ? `<p style="margin:22px 0"><a href="${esc(action.url)}" style="background:#7a4a24;color:#fffaf2;text-decoration:none;padding:10px 18px;border-radius:4px;font-weight:600">${esc(action.label)}</a></p><p style="font-size:13px;color:#5b5148">Or paste this address into your browser: ${esc(action.url)}</p>`
    : '';
  return `<!doctype html><html><body style="margin:0;background:#f6f1e7;font-family:'Source Sans 3',Helvetica,Arial,sans-serif;color:#231c15"><div style="max-width:560px;margin:0 auto;padding:28px"><div style="border-bottom:3px solid #7a4a24;padding-bottom:8px;margin-bottom:20px;font-weight:700;letter-spacing:.02em">${esc(shop)}</div><h1 style="font-size:20px;margin:0 0 16px">${esc(heading)}</h1>${body}${button}<p style="font-size:12px;color:#5b5148;margin-top:28px">Sent by ${esc(shop)} through Benchwright.</p></div></body></html>`;
}

function text(paragraphs: string[], action?: { label: string; url: string }, shop?: string): string {
  return [...paragraphs, ...(action ? [`${action.label}: ${action.url}`] : []), '', `-- ${shop}`].join('\n\n');
}

export function verificationMail(shop: string, name: string, url: string): MailContent {
  const p = [`Hello ${name},`, `Please confirm that this is your e-mail address, so ${shop} can send you estimates and news of your project. The link works for 48 hours.`];
  const a = { label: 'Confirm my e-mail', url };
  return { subject: `Confirm your e-mail for ${shop}`, text: text(p, a, shop), html: layout(shop, 'Confirm your e-mail', p, a) };
}

export function resetMail(shop: string, name: string, url: string): MailContent {
  const p = [`Hello ${name},`, 'Someone asked to reset the password of your account. If it was you, choose a new password with the link below; it works for one hour and only once. If it was not you, ignore this message: your password stays as it is.'];
  const a = { label: 'Choose a new password', url };
  return { subject: `Reset your ${shop} password`, text: text(p, a, shop), html: layout(shop, 'Reset your password', p, a) };
}

export function invitationMail(shop: string, name: string, inviter: string, url: string): MailContent {
  const p = [`Hello ${name},`, `${inviter} has invited you to the ${shop} shop app, where the production board, the travellers and the hour logs live. Set your password with the link below; it works for 7 days.`];
  const a = { label: 'Set my password', url };
  return { subject: `You're invited to the ${shop} shop app`, text: text(p, a, shop), html: layout(shop, 'Join the shop app', p, a) };
}
