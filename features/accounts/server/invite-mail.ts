import 'server-only';
import type { Role } from '@/db/schema';
import { formatShopTimeForMail } from '@/features/ui/shop-time';
import { ROLE_LABELS } from '@/server/auth/permissions';

const escape = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

/** `timeZone` is the shop's: the expiry is read as the shop's time, with the zone's name spelled out. */
export function inviteMail(p: {
  shopName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
  timeZone: string;
}) {
  const role = ROLE_LABELS[p.role].toLowerCase();
  const until = formatShopTimeForMail(p.expiresAt, p.timeZone);
  const subject = `${p.inviterName} invited you to ${p.shopName} on Ringpass`;
  const text = [
    `${p.inviterName} invited you to join ${p.shopName} on Ringpass as a ${role}.`,
    '',
    `Accept the invite and choose your password: ${p.link}`,
    '',
    `The link works once and expires ${until}. If you were not expecting this, ignore this e-mail.`,
  ].join('\n');
  const html = `<p>${escape(p.inviterName)} invited you to join <strong>${escape(p.shopName)}</strong> on Ringpass as a ${role}.</p>
<p><a href="${escape(p.link)}">Accept the invite and choose your password</a></p>
<p>The link works once and expires ${escape(until)}. If you were not expecting this, ignore this e-mail.</p>`;
  return { subject, text, html };
}
