import { describe, expect, it } from 'vitest';
import { commentMail } from '../../../server/mail/templates';

describe('comment mail', () => {
  it('links its footer and List-Unsubscribe to the account page, which is where the setting is', () => {
    const mail = commentMail(
      { publicUrl: 'https://hoverprint.example' },
      {
        kind: 'comment-on-flight',
        to: 'tobin@example.com',
        author: 'Wren',
        flightName: 'Kite, 3 Dec',
        flightId: '00000000-0000-4000-8000-000000000001',
        commentId: '00000000-0000-4000-8000-000000000002',
        tS: 12.5,
        body: 'Motor 3 works hard here.',
      },
    );
    expect(mail.text).toContain('Turn it off at https://hoverprint.example/account');
    expect(mail.headers).toEqual({ 'List-Unsubscribe': '<https://hoverprint.example/account>' });
  });
});
