import 'server-only';

// Mails that tell the owner of an address what someone did with it, and the link that finishes
// a sign-up. Whether an address has an account is said only here, to the address itself.

export const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

const paragraphs = (lines: string[]) => lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('\n');

export function inviteToExistingAccountMail(p: { shopName: string; inviterName: string }) {
  const subject = `${p.inviterName} tried to invite you to ${p.shopName} on Ringpass`;
  const lines = [
    `${p.inviterName} tried to invite this address to join ${p.shopName} on Ringpass.`,
    'This address already has a Ringpass account, and an address can belong to one shop only, so no invite link was made.',
    `If you want to join ${p.shopName}, tell them to invite another address of yours. If you were not expecting this, ignore this e-mail; your account is unchanged.`,
  ];
  return { subject, text: lines.join('\n\n'), html: paragraphs(lines) };
}

export function signUpWithExistingAccountMail(p: { signInUrl: string }) {
  const subject = 'Someone tried to create a Ringpass shop with your address';
  const lines = [
    'Someone tried to create a new shop on Ringpass with this e-mail address.',
    'This address already has a Ringpass account, so no shop was created and nothing changed.',
    `If it was you, sign in instead: ${p.signInUrl}`,
    'If it was not you, you can ignore this e-mail; nobody can sign in without your password.',
  ];
  return { subject, text: lines.join('\n\n'), html: paragraphs(lines) };
}

export function finishSignUpMail(p: { shopName: string; link: string; hours: number }) {
  const subject = `Finish creating ${p.shopName} on Ringpass`;
  const lines = [
    `To finish creating ${p.shopName} on Ringpass, open this link: ${p.link}`,
    `The link works once and for ${p.hours} hours. If you did not ask for this, ignore this e-mail and nothing is created.`,
  ];
  return { subject, text: lines.join('\n\n'), html: paragraphs(lines) };
}
