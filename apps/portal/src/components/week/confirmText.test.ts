import { describe, expect, test } from 'vitest';
import { confirmText } from './confirmText.ts';

const report = (over: object = {}) => ({ crews: 2, sent: 2, mailOff: false, crewsWithoutLead: [], failed: 0, ...over });

describe('confirmText', () => {
  test('should count the orders and e-mails when every crew lead was told', () => {
    expect(confirmText(12, report())).toEqual({ text: '12 work orders assigned; 2 e-mails sent to crew leads.', warning: false });
  });

  test('should say e-mail is off rather than "0 e-mails sent"', () => {
    const said = confirmText(5, report({ sent: 0, mailOff: true }));
    expect(said.warning).toBe(true);
    expect(said.text).toMatch(/no e-mail sent: e-mail is not set up on this server/);
    expect(said.text).not.toMatch(/0 e-mails/);
  });

  test('should name the crews without a crew-lead account and the refused e-mails', () => {
    expect(confirmText(3, report({ sent: 0, crewsWithoutLead: ['South Crew'], failed: 1 })).text).toBe(
      '3 work orders assigned; 0 e-mails sent to crew leads (South Crew has no crew-lead account to write to; the mail server did not take 1 e-mail).',
    );
  });
});
