import type { MailMessage } from '../../common/mail.js';
import type { AcceptanceDecision } from '../../../shared/fit/index.js';

const VERDICTS: Record<AcceptanceDecision, string> = {
  accept: 'accepted against the design spread (guarded acceptance)',
  undecided: 'UNDECIDED against the design spread (in a guard band)',
  reject: 'REJECTED: outside the design spread',
};

export function sessionCompleteMessage(opts: {
  to: string; serialNumber: string; channelName: string; designName: string; revisionLetter: string; testerName: string;
  decision: AcceptanceDecision | null; summary: string; link: string;
}): MailMessage {
  const verdict = opts.decision === null ? 'not compared with the design' : VERDICTS[opts.decision];
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
