import { loadConfig } from '../../../server/config';
import { labTimeZone, mailDay, mailTime } from '../../../server/mail/lab-time';
import { messages } from '../../../server/mail/messages';

const booking = {
  id: 7,
  personName: 'Noor Haddad',
  itemTags: ['GST-0002', 'PSU-0001'],
  plannedKv: 30,
  endsAt: '2026-12-03T14:39:00.000Z',
  purpose: 'corona sweep',
};
const ISO = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

describe('e-mail times', () => {
  it('writes a timestamp on the lab clock and names the clock', () => {
    expect(mailTime('2026-12-03T14:39:00.000Z', 'UTC')).toBe('at 14:39 on Thu 3 Dec 2026 (UTC time)');
    // Central European Time is UTC+1 in December (no summer time then): common practice, no source.
    expect(mailTime('2026-12-03T14:39:00.000Z', 'Europe/Berlin')).toBe('at 15:39 on Thu 3 Dec 2026 (Europe/Berlin time)');
    // Summer time (UTC+2) from the last Sunday of March: 29 March 2026 (EU rule, Directive 2000/84/EC).
    expect(mailTime('2026-03-29T12:00:00.000Z', 'Europe/Berlin')).toBe('at 14:00 on Sun 29 Mar 2026 (Europe/Berlin time)');
  });

  it('writes a calendar date without shifting it a day', () => {
    expect(mailDay('2026-12-01')).toBe('Tue 1 Dec 2026');
  });

  it('takes the lab time zone from LAB_TIME_ZONE, and refuses an unknown one at start', () => {
    expect(labTimeZone({ LAB_TIME_ZONE: 'America/Chicago' })).toBe('America/Chicago');
    expect(() => loadConfig({ LAB_TIME_ZONE: 'Mars/Olympus' })).toThrow(/LAB_TIME_ZONE: an IANA time zone name/);
  });

  it('puts no raw ISO timestamp in any message that mentions a time', () => {
    const texts = [
      messages.overdueToMember('http://lab.example', booking),
      messages.overdueToOfficer('http://lab.example', booking, 30),
      messages.invitation('http://lab.example', 'Kofi', 'Ada', 'tok', '2026-12-10T09:00:00.000Z'),
      messages.passwordReset('http://lab.example', 'Kofi', 'tok', '2026-12-03T15:00:00.000Z'),
      messages.inspectionDigest('http://lab.example', [{ tag: 'GST-0002', name: 'Grounding stick', dueOn: '2026-12-01' }], [], '2026-12-03'),
    ];
    for (const mail of texts) {
      expect(mail.text).not.toMatch(ISO);
      expect(mail.html).not.toMatch(ISO);
      expect(mail.subject).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    }
    expect(texts[0]!.text).toMatch(/ended at \d{2}:\d{2} on \w{3} 3 Dec 2026 \(.+ time\)/);
  });

  it('links to the address the server is served at', () => {
    const { publicUrl } = loadConfig({ HOST: '127.0.0.1', PORT: '8183' });
    expect(publicUrl).toBe('http://127.0.0.1:8183');
    expect(messages.overdueToMember(publicUrl, booking).text).toContain('http://127.0.0.1:8183/bookings/7');
    expect(loadConfig({ PORT: '8183', PUBLIC_URL: 'https://hv.lab.example/' }).publicUrl).toBe('https://hv.lab.example');
  });
});
