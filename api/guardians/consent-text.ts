import type { ConsentText } from '../../shared/schemas/mail';

/**
 * The consent a guardian gives before any Family digest is sent. The version is recorded
 * with the consent, so a later change of wording is visible in the record.
 */
export const CONSENT_TEXT = {
  version: '2026-12-01',
  text:
    'I agree that the club may e-mail me a weekly Family digest about my child’s kicking training: ' +
    'their first name, the number of logged repetitions, how often they were on target and one highlight. ' +
    'It contains nothing about other children. I can stop the e-mails at any time with the link in each ' +
    'digest or here, and withdraw this consent at any time. The club handles this data under its ' +
    'safeguarding policy and the data-protection law that applies to it.',
} as const satisfies ConsentText;
