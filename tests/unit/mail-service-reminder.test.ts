import { describe, expect, it } from 'vitest';
import { renderServiceReminder } from '../../server/services/mail-templates/service-reminder';

const data = {
  name: 'Robin <script>alert("x")</script> & Co',
  serial: 'VC26-000017-1',
  what: 'GIM-10-0201 Vanecraft Gimlet (GIM) turbocharger, journal bearing',
  bearingAndUse: 'journal bearing, circuit',
  intervalMonths: 3,
  dueOn: '2027-03-03',
  lastService: '2026-12-03',
  bookUrl: 'https://shop.example/service/new?serial=VC26-000017-1',
  unitUrl: 'https://shop.example/units/VC26-000017-1',
};

describe('service reminder mail', () => {
  it('names the unit, the due date and the interval, and links to the booking page in both parts', () => {
    const mail = renderServiceReminder(data);
    expect(mail.subject).toBe('Service due for unit VC26-000017-1');
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('2027-03-03');
      expect(part).toContain('every 3 months');
      expect(part).toContain('/service/new?serial=VC26-000017-1');
      expect(part).toContain('common practice');
    }
    expect(mail.text).toMatch(/Caution: Let the unit cool/);
  });

  it('escapes what the buyer typed in the HTML part and refuses a link that is not a web address', () => {
    const mail = renderServiceReminder(data);
    expect(mail.html).not.toContain('<script>');
    expect(mail.html).toContain('&lt;script&gt;');
    expect(() => renderServiceReminder({ ...data, bookUrl: 'javascript:alert(1)' })).toThrow();
  });
});
