import type { MailMessage } from '../../common/mail.js';

export function sessionCompleteMessage(opts: {
  to: string; serialNumber: string; channelName: string; designName: string; revisionLetter: string; testerName: string;
  within: boolean | null; summary: string; link: string;
}): MailMessage {
  const verdict = opts.within === null ? 'not compared with the design' : opts.within ? 'within the design spread' : 'OUTSIDE the design spread';
  const text = [
    `${opts.testerName} completed a calibration of board ${opts.serialNumber}, ${opts.channelName}`,
    `(${opts.designName}, revision ${opts.revisionLetter}).`,
    '',
    `Result: ${verdict}.`,
    opts.summary,
    '',
    `Open the session: ${opts.link}`,
  ].join('\n');
  return { to: opts.to, subject: `Calibration of ${opts.serialNumber} ${opts.channelName}: ${verdict}`, text };
}
