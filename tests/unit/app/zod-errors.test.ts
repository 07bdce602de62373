import { z } from 'zod';

import { unitOfField } from '@/shared/zod-errors';
import { checklistTemplateItemSchema, labRulesSchema } from '@/shared/schemas/bookings';
import { signInSchema } from '@/shared/schemas/session';

const messagesOf = (result: { success: boolean; error?: z.ZodError }) =>
  Object.fromEntries((result.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('the shared zod error map', () => {
  it('reads the unit from the field name', () => {
    expect(unitOfField('plannedKv')).toBe('kV');
    expect(unitOfField('bleederMohm')).toBe('MΩ');
    expect(unitOfField('overdueGraceMin')).toBe('minutes');
    expect(unitOfField('ratingMarginPct')).toBe('%');
    expect(unitOfField('safeResidualV')).toBe('V');
    expect(unitOfField('maxCurrentMa')).toBe('mA');
    expect(unitOfField('cableLengthM')).toBe('m');
    expect(unitOfField('position')).toBe('');
    expect(unitOfField('text')).toBe('');
  });

  it('says number limits with their unit', () => {
    const rules = {
      approvalKv: 400,
      energyThresholdJ: -1,
      ratingMarginPct: 10,
      interlockKv: 1.5,
      safeResidualV: 50,
      earlyPickupMin: 15,
      overdueGraceMin: 99999,
    };
    expect(messagesOf(labRulesSchema.safeParse(rules))).toEqual({
      approvalKv: 'At most 300 kV',
      energyThresholdJ: 'At least 0 J',
      overdueGraceMin: 'At most 10080 minutes',
    });
  });

  it('says text lengths in characters and never leaks zod’s stock wording', () => {
    const result = checklistTemplateItemSchema.safeParse({ phase: 'pre', kind: 'confirm', text: 'ab', required: true, position: 1 });
    const messages = Object.values(messagesOf(result));
    expect(messages).toContain('Use at least 3 characters');
    for (const m of messages) expect(m).not.toMatch(/Too small|Too big|expected|Invalid (ISO|input|option)/);
  });

  it('words dates, numbers and choices plainly', () => {
    const schema = z.object({ on: z.iso.date(), count: z.number().int(), kind: z.enum(['a', 'b']), reading: z.number() });
    expect(messagesOf(schema.safeParse({ on: '3/12/2026', count: 1.5, kind: 'c', reading: Number.NaN }))).toEqual({
      on: 'Enter a date as YYYY-MM-DD, e.g. 2026-12-03',
      count: 'Enter a whole number',
      kind: 'Choose one of the options',
      reading: 'Enter a number',
    });
    expect(messagesOf(z.object({ name: z.string() }).safeParse({}))).toEqual({ name: 'Fill this in' });
  });

  it('keeps a schema’s own message', () => {
    const result = signInSchema.safeParse({ email: 'not-an-address', password: '' });
    for (const m of Object.values(messagesOf(result))) expect(m).not.toMatch(/Invalid|expected/);
  });
});
