import fs from 'node:fs';
import path from 'node:path';

import { auditWords } from '@/components/audit/audit-words';
import type { AuditEvent } from '@/shared/schemas/audit';

function event(action: string, entity: string, fields: Partial<AuditEvent> = {}): AuditEvent {
  return {
    id: 1,
    at: '2026-12-03T10:00:00.000Z',
    actorId: 2,
    actorName: 'Ada Okafor',
    entity,
    entityId: '12',
    action,
    before: null,
    after: null,
    subject: null,
    ...fields,
  };
}

/** Every action the server writes, read from its source so a new one cannot go unworded. */
function serverActions(): string[] {
  const dir = path.join(__dirname, '../../../server/services');
  const found = new Set<string>();
  for (const file of fs.readdirSync(dir)) {
    const source = fs.readFileSync(path.join(dir, file), 'utf8');
    for (const m of source.matchAll(
      /'((?:booking|approval|checklist|checklist-template|item|inspection|lab-rules|person|qualification|incident|calendar-feed)\.[a-z-]+)'/g,
    ))
      found.add(m[1]!);
  }
  // Built from a template in the source: `checklist.${phase}-completed`, `inspection.${result}`.
  for (const a of ['checklist.pre-completed', 'checklist.return-completed', 'inspection.pass', 'inspection.fail']) found.add(a);
  return [...found].sort();
}

const entityOf = (action: string) =>
  action.startsWith('inspection.')
    ? 'item'
    : action.startsWith('calendar-feed.')
      ? 'person'
      : action.startsWith('approval.') || action.startsWith('checklist.')
        ? 'booking'
        : action.split('.')[0]!;

describe('auditWords', () => {
  it('finds the server’s actions (the scan itself works)', () => {
    expect(serverActions()).toEqual(
      expect.arrayContaining([
        'booking.item-scanned',
        'item.tagged-out-at-return',
        'qualification.set',
        'person.invited',
        'incident.reported',
        'calendar-feed.rotated',
      ]),
    );
  });

  it.each(serverActions())('words %s as a sentence, never its code', (action) => {
    const words = auditWords(
      event(action, entityOf(action), { subject: { tag: 'GST-0002', name: 'Grounding stick', personName: 'Noor Haddad', tags: ['GST-0002'] } }),
    );
    expect(words.sentence).not.toContain(action);
    expect(words.sentence).not.toMatch(/made a change to/);
    expect(words.sentence).toMatch(/^[A-Z].*\.$/);
  });

  it('says who scanned what for which booking, and links to the booking', () => {
    const words = auditWords(event('booking.item-scanned', 'booking', { after: { itemId: 4, tag: 'GST-0002' } }));
    expect(words.sentence).toBe('Ada Okafor scanned GST-0002 at the counter for booking #12.');
    expect(words.link).toEqual({ href: '/bookings/12', label: 'Open booking #12' });
  });

  it('names an item by tag and name, links to it, and gives a tag-out reason as the detail', () => {
    const words = auditWords(
      event('item.tagged-out-at-return', 'item', {
        entityId: '7',
        subject: { tag: 'PSU-0003', name: 'Bench supply' },
        after: { statusReason: 'Damaged on return of booking 12: cracked lead' },
      }),
    );
    expect(words.sentence).toBe('Ada Okafor tagged PSU-0003 (Bench supply) out of service when it came back damaged.');
    expect(words.detail).toBe('Damaged on return of booking 12: cracked lead');
    expect(words.link).toEqual({ href: '/gear/7', label: 'Open PSU-0003' });
  });

  it('writes a booking with its gear, voltage and waiting state', () => {
    const words = auditWords(
      event('booking.created', 'booking', {
        subject: { personName: 'Noor', tags: ['GST-0002', 'PSU-0001'] },
        after: { status: 'awaiting-approval', plan: { plannedKv: 45 } },
      }),
    );
    expect(words.sentence).toBe('Ada Okafor booked GST-0002, PSU-0001 for a test at 45 kV (booking #12); it waits for a safety officer.');
  });

  it('lists changed lab rules by name', () => {
    const words = auditWords(
      event('lab-rules.updated', 'lab-rules', { before: { approvalKv: 15, overdueGraceMin: 30 }, after: { approvalKv: 20, overdueGraceMin: 30 } }),
    );
    expect(words.detail).toBe('Changed: approval voltage');
  });

  it('says "Voltcrib" for entries no person made', () => {
    expect(auditWords(event('item.created', 'item', { actorName: null, actorId: null })).sentence).toBe('Voltcrib registered item #12.');
  });
});
