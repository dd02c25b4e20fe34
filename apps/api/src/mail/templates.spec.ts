import { escapeHtml, invitationMail } from './templates';

describe('mail templates', () => {
  it('escapes the five HTML special characters (OWASP XSS Prevention Cheat Sheet, rule 1)', () => {
    expect(escapeHtml(`<a href="x">Tom & 'Jerry'</a>`)).toBe(
      '&lt;a href=&quot;x&quot;&gt;Tom &amp; &#39;Jerry&#39;&lt;/a&gt;',
    );
  });

  it('puts the link in both bodies and escapes names in HTML', () => {
    const m = invitationMail({
      displayName: '<script>alert(1)</script>',
      organisationName: 'Larkfield & Co',
      invitedBy: 'Alex',
      link: 'http://localhost:3000/accept-invitation?token=abc&x=1',
      validDays: 7,
    });
    expect(m.text).toContain('http://localhost:3000/accept-invitation?token=abc&x=1');
    expect(m.text).toContain('expires in 7 days');
    expect(m.html).toContain('href="http://localhost:3000/accept-invitation?token=abc&amp;x=1"');
    expect(m.html).not.toContain('<script>');
    expect(m.html).toContain('Larkfield &amp; Co');
    expect(m.subject).toBe('You are invited to Rotaplex at Larkfield & Co');
  });
});
