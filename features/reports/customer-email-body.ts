import type { ReportView } from './view-model';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** The customer's e-mail in plain words: what was done, the link, the re-check and the caution line. */
export function customerEmailBody(view: ReportView, link: string) {
  const subject = `Your completion report: job ${view.jobNumber}, ${view.vehicle} (${view.shop.name})`;
  const signed = view.signedOff
    ? `Signed off by ${view.signedOff.by} on ${view.signedOff.at}.`
    : '';
  const recheck = view.recheck
    ? [
        `Ring bolt re-check due by ${view.recheck.dueOn}: please bring the vehicle back after the first ride for`,
        ...view.recheck.what.map((w) => `- ${w}`),
      ]
    : [];
  const text = [
    `Hello ${view.customer},`,
    '',
    `${view.shop.name} has finished job ${view.jobNumber} on your ${view.vehicle} (VIN ${view.vin}).`,
    view.summary,
    signed,
    '',
    'Your completion report (which bolts, which torque, with which wrench, when and by whom, with the photos) is attached, and online for 90 days at:',
    link,
    '',
    ...recheck,
    '',
    view.cautions[0]!,
    view.makerFirst,
    '',
    view.shop.name + (view.shop.contact ? ` · ${view.shop.contact}` : ''),
  ].join('\n');
  const html = `<p>Hello ${escape(view.customer)},</p>
<p>${escape(view.shop.name)} has finished <strong>job ${view.jobNumber}</strong> on your ${escape(view.vehicle)} (VIN ${escape(view.vin)}).</p>
<p>${escape(view.summary)} ${escape(signed)}</p>
<p>Your completion report is attached, and online for 90 days: <a href="${escape(link)}">open your report</a><br>${escape(link)}</p>
${
  view.recheck
    ? `<p><strong>Ring bolt re-check due by ${escape(view.recheck.dueOn)}</strong></p><ul>${view.recheck.what.map((w) => `<li>${escape(w)}</li>`).join('')}</ul>`
    : ''
}
<p>${escape(view.cautions[0]!)}</p>
<p><em>${escape(view.makerFirst)}</em></p>
<p>${escape(view.shop.name)}${view.shop.contact ? ` · ${escape(view.shop.contact)}` : ''}</p>`;
  return { subject, text, html };
}
