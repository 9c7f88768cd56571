import { formatDate } from '@benchwright/contracts';
/** Our own plain, warm mail look: ink on paper, a wood-brown rule, the shop's name. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

/** Where the layout shows the shop's logo: the mailer (lib/mailer.ts) puts the inline image there, or nothing. */
export const LOGO_MARK = '<!--shop-logo-->';
export const LOGO_CID = 'shop-logo@benchwright';

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function layout(
  shop: string,
  heading: string,
  paragraphs: string[],
  action?: { label: string; url: string },
  extraHtml = '',
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px;line-height:1.5">${esc(p)}</p>`).join('');
  const button = action
    ? `<p style="margin:22px 0"><a href="${esc(action.url)}" style="background:#7a4a24;color:#fffaf2;text-decoration:none;padding:10px 18px;border-radius:4px;font-weight:600">${esc(action.label)}</a></p><p style="font-size:13px;color:#5b5148">Or paste this address into your browser: ${esc(action.url)}</p>`
    : '';
  return `<!doctype html><html><body style="margin:0;background:#f6f1e7;font-family:'Source Sans 3',Helvetica,Arial,sans-serif;color:#231c15"><div style="max-width:560px;margin:0 auto;padding:28px">${LOGO_MARK}<div style="border-bottom:3px solid #7a4a24;padding-bottom:8px;margin-bottom:20px;font-weight:700;letter-spacing:.02em">${esc(shop)}</div><h1 style="font-size:20px;margin:0 0 16px">${esc(heading)}</h1>${body}${extraHtml}${button}${SIGNATURE}</div></body></html>`;
}

// the templates leave the signature out: `signMail` adds the shop's own, so every mail ends the same way
function text(paragraphs: string[], action?: { label: string; url: string }): string {
  return [...paragraphs, ...(action ? [`${action.label}: ${action.url}`] : [])].join('\n\n');
}

const SIGNATURE = '<!--signature-->';

/** The shop as it signs its mail: from the shop settings (name, address, phone). */
export interface ShopSignature {
  name: string;
  address: string;
  phone: string;
}

/**
 * Ends a mail with the shop's own signature, in its own voice: its name, then
 * its address and phone when the shop has set them. The mailer signs every
 * message it queues, so no template can forget.
 * @example signMail(verificationMail('Fernhill Joinery', ...), { name: 'Fernhill Joinery', address: '...', phone: '...' })
 */
export function signMail(content: MailContent, shop: ShopSignature): MailContent {
  const lines = [shop.name, ...shop.address.split(/\r?\n/), shop.phone].map((l) => l.trim()).filter(Boolean);
  const html = `<p style="font-size:13px;color:#5b5148;margin-top:28px;border-top:1px solid #d8cbb8;padding-top:12px">${lines.map(esc).join('<br>')}</p>`;
  return {
    ...content,
    text: `${content.text.replace(/\s+$/, '')}\n\n-- \n${lines.join('\n')}\n`,
    html: content.html.includes(SIGNATURE) ? content.html.replace(SIGNATURE, html) : content.html,
  };
}

export function verificationMail(shop: string, name: string, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `Please confirm that this is your e-mail address, so ${shop} can send you estimates and news of your project. The link works for 48 hours.`,
  ];
  const a = { label: 'Confirm my e-mail', url };
  return {
    subject: `Confirm your e-mail for ${shop}`,
    text: text(p, a),
    html: layout(shop, 'Confirm your e-mail', p, a),
  };
}

export function resetMail(shop: string, name: string, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    'Someone asked to reset the password of your account. If it was you, choose a new password with the link below; it works for one hour and only once. If it was not you, ignore this message: your password stays as it is.',
  ];
  const a = { label: 'Choose a new password', url };
  return {
    subject: `Reset your ${shop} password`,
    text: text(p, a),
    html: layout(shop, 'Reset your password', p, a),
  };
}

export function invitationMail(shop: string, name: string, inviter: string, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `${inviter} has invited you to the ${shop} shop app, where the production board, the travelers and the hour logs live. Set your password with the link below; it works for 7 days.`,
  ];
  const a = { label: 'Set my password', url };
  return {
    subject: `You're invited to the ${shop} shop app`,
    text: text(p, a),
    html: layout(shop, 'Join the shop app', p, a),
  };
}

/** A client the owner took down by phone or at the door: claim the account in the portal. */
export function clientInvitationMail(
  shop: string,
  name: string,
  inviter: string,
  url: string,
  project?: string,
): MailContent {
  const p = [
    `Hello ${name},`,
    project
      ? `${inviter} at ${shop} has started a project for you: ${project}. Its estimate, drawings and progress will be in the ${shop} client portal.`
      : `${inviter} at ${shop} has made you an account in the ${shop} client portal, where your estimates, drawings and the progress of your work will be.`,
    'Choose a password with the link below to claim the account; it works for 7 days. If you were not expecting this, ignore this message.',
  ];
  const a = { label: 'Claim my account', url };
  return {
    subject: project ? `${shop} has started a project for you` : `Your account with ${shop}`,
    text: text(p, a),
    html: layout(shop, project ? 'A project for you' : 'Claim your account', p, a),
  };
}

/** The owner started a project for a client who already has an account. */
export function projectStartedMail(
  shop: string,
  name: string,
  inviter: string,
  project: string,
  url: string,
): MailContent {
  const p = [
    `Hello ${name},`,
    `${inviter} at ${shop} has started a project for you: ${project}. Its estimate will follow in the portal, where you can ask anything.`,
  ];
  const a = { label: 'Open the project', url };
  return {
    subject: `${shop} has started a project for you`,
    text: text(p, a),
    html: layout(shop, 'A project for you', p, a),
  };
}

const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
/** Dollars as the mails write them: $1,234.50. */
export const dollars = (cents: number) => usd.format(cents / 100);

export function estimateMail(
  shop: string,
  name: string,
  revision: number,
  totalCents: number,
  depositCents: number,
  validUntil: Date,
  url: string,
): MailContent {
  const p = [
    `Hello ${name},`,
    `Your estimate from ${shop} is ready (revision ${revision}): ${dollars(totalCents)} in all, with a deposit of ${dollars(depositCents)} to start the work. The PDF is attached.`,
    `It holds until ${formatDate(validUntil)}. Read it, ask anything in the portal, and accept it there when you are ready.`,
  ];
  const a = { label: 'See the estimate', url };
  return {
    subject: `Your estimate from ${shop} (revision ${revision})`,
    text: text(p, a),
    html: layout(shop, 'Your estimate is ready', p, a),
  };
}

/** The owner took back an accepted revision (before any deposit): say so, with their reason. */
export function withdrawnMail(shop: string, name: string, revision: number, reason: string, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `${shop} has withdrawn revision ${revision} of your estimate, which you had accepted. No deposit was taken. Their reason:`,
    `“${reason}”`,
    'A new revision will follow in the portal; you can ask anything there.',
  ];
  const a = { label: 'Open the project', url };
  return {
    subject: `Revision ${revision} of your estimate from ${shop} is withdrawn`,
    text: text(p, a),
    html: layout(shop, 'An estimate is withdrawn', p, a),
  };
}

export function depositReceiptMail(shop: string, name: string, amountCents: number, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `We have received your deposit of ${dollars(amountCents)}. Thank you: your piece is now on our production board, and we will order the material.`,
    'You can follow it through the shop in the portal.',
  ];
  const a = { label: 'Follow my project', url };
  return {
    subject: `Deposit receipt: ${dollars(amountCents)} received by ${shop}`,
    text: text(p, a),
    html: layout(shop, 'Deposit received', p, a),
  };
}

export function ownerDepositNotice(shop: string, client: string, amountCents: number, url: string): MailContent {
  const p = [`${client} has paid a deposit of ${dollars(amountCents)}. The job is on the board in Material.`];
  const a = { label: 'Open the board', url };
  return {
    subject: `Paid: ${client}'s deposit of ${dollars(amountCents)}`,
    text: text(p, a),
    html: layout(shop, 'A deposit came in', p, a),
  };
}

/** Progress photos shown in a stage mail: inline thumbnails, by the `cid` of each attachment. */
export interface StagePhotos {
  photos: { cid: string }[];
  /** the stage they were taken in (the one just left) */
  fromLabel: string;
}

function photosHtml(shown?: StagePhotos): string {
  if (!shown?.photos.length) return '';
  const imgs = shown.photos
    .map(
      (p, i) =>
        `<img src="cid:${esc(p.cid)}" alt="Photo ${i + 1} from the ${esc(shown.fromLabel)} stage" width="160" style="width:160px;height:auto;margin:0 8px 8px 0;border:1px solid #d9cdb8;border-radius:4px">`,
    )
    .join('');
  return `<p style="margin:0 0 8px;line-height:1.5">${esc(photosLine(shown))}</p><div style="margin:0 0 14px">${imgs}</div>`;
}
const photosLine = (shown: StagePhotos) =>
  `${shown.photos.length === 1 ? 'A photo' : `${shown.photos.length} photos`} from the ${shown.fromLabel} stage, just finished:`;
const photosText = (shown?: StagePhotos) =>
  shown?.photos.length ? [`${photosLine(shown)} they are attached to this message.`] : [];

export function balanceRequestMail(
  shop: string,
  name: string,
  amountCents: number,
  url: string,
  shown?: StagePhotos,
): MailContent {
  const p = [
    `Hello ${name},`,
    `Your piece is finished and ready. The balance of ${dollars(amountCents)} is now due; you can pay it in the portal, and we will arrange delivery.`,
  ];
  const a = { label: 'Pay the balance', url };
  return {
    subject: `Your piece is ready: balance of ${dollars(amountCents)} due`,
    text: text([...p, ...photosText(shown)], a),
    html: layout(shop, 'Ready for you', p, a, photosHtml(shown)),
  };
}

export function balanceReceiptMail(shop: string, name: string, amountCents: number, url: string): MailContent {
  const p = [`Hello ${name},`, `We have received the balance of ${dollars(amountCents)}. Thank you.`];
  const a = { label: 'See my project', url };
  return {
    subject: `Balance receipt: ${dollars(amountCents)} received by ${shop}`,
    text: text(p, a),
    html: layout(shop, 'Balance received', p, a),
  };
}

export function refundMail(shop: string, name: string, amountCents: number, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `We have refunded ${dollars(amountCents)} to your card. It usually shows on your statement within 5 to 10 business days.`,
  ];
  const a = { label: 'See my project', url };
  return {
    subject: `Refund of ${dollars(amountCents)} from ${shop}`,
    text: text(p, a),
    html: layout(shop, 'Refund sent', p, a),
  };
}

/** The one mail of a stage change: the news in the client's words, and the photos of the stage just left. */
export function stageMail(shop: string, name: string, news: string, url: string, shown?: StagePhotos): MailContent {
  const p = [`Hello ${name},`, news];
  const a = { label: 'See my project', url };
  const headline = news.split('. ').at(-1)?.replace(/\.$/, '') ?? news;
  return {
    subject: `${headline}: news from ${shop}`,
    text: text([...p, ...photosText(shown)], a),
    html: layout(shop, 'News from the shop', p, a, photosHtml(shown)),
  };
}

export function commentMail(shop: string, toName: string, fromName: string, comment: string, url: string): MailContent {
  const p = [`Hello ${toName},`, `${fromName} wrote about the project:`, `“${comment}”`];
  const a = { label: 'Open the project', url };
  return {
    subject: `A comment from ${fromName}`,
    text: text(p, a),
    html: layout(shop, `A comment from ${fromName}`, p, a),
  };
}

export function requestNotice(
  shop: string,
  ownerName: string,
  client: string,
  items: number,
  url: string,
): MailContent {
  const what = items === 1 ? 'one piece' : `${items} pieces`;
  const p = [`Hello ${ownerName},`, `${client} asked for an estimate for ${what}. The request is waiting in Requests.`];
  const a = { label: 'Open the request', url };
  return {
    subject: `New request from ${client}`,
    text: text(p, a),
    html: layout(shop, `A request from ${client}`, p, a),
  };
}

export function emailChangeMail(shop: string, name: string, url: string): MailContent {
  const p = [
    `Hello ${name},`,
    `You asked ${shop} to use this address for your account from now on. Confirm it with the link below; it works for 48 hours and only once. Until then, mail keeps going to your old address.`,
    'If you did not ask for this, ignore this message: nothing changes.',
  ];
  const a = { label: 'Use this address', url };
  return {
    subject: `Confirm your new e-mail for ${shop}`,
    text: text(p, a),
    html: layout(shop, 'Confirm your new e-mail', p, a),
  };
}

/** To the old address when a change is asked for, so a stolen session cannot move the account quietly. */
export function emailChangeNoticeMail(shop: string, name: string, newEmail: string): MailContent {
  const p = [
    `Hello ${name},`,
    `Someone signed in to your ${shop} account asked to use ${newEmail} as its address. It changes only when the link sent there is followed.`,
    'If this was not you, change your password on your account page and end the sessions you do not recognise.',
  ];
  return {
    subject: `A new e-mail was asked for your ${shop} account`,
    text: text(p),
    html: layout(shop, 'A new e-mail was asked for', p),
  };
}
