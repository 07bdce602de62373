import { addCalendarMonths, feetToMetres, hotStickTestVoltage, isOverdue, nextDue } from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

describe('hotStickTestVoltage (29 CFR 1910.269(j))', () => {
  const threeFeet = feetToMetres(3);

  it('a 3 ft FRP section is tested in service at 225 kV for 60 s (1910.269(j)(2), 75 000 V/ft, confirmed; domain check 29)', () => {
    const result = hotStickTestVoltage({ lengthM: threeFeet, material: 'frp', test: 'in-service' });
    expectWithin(result.testVoltageV, 225e3);
    expect(result.durationS).toBe(60);
    expect(result.marker).toBe('confirmed');
  });

  it('its design test is 300 kV for 300 s (1910.269(j)(1), 100 000 V/ft for 5 min, confirmed; domain check 29)', () => {
    const result = hotStickTestVoltage({ lengthM: threeFeet, material: 'frp', test: 'design' });
    expectWithin(result.testVoltageV, 300e3);
    expect(result.durationS).toBe(300);
  });

  it('a 3 ft wood tool: design 225 kV for 180 s (confirmed), in service 150 kV for 60 s (from memory)', () => {
    const design = hotStickTestVoltage({ lengthM: threeFeet, material: 'wood', test: 'design' });
    expectWithin(design.testVoltageV, 225e3);
    expect(design.durationS).toBe(180);
    const inService = hotStickTestVoltage({ lengthM: threeFeet, material: 'wood', test: 'in-service' });
    expectWithin(inService.testVoltageV, 150e3);
    expect(inService.marker).toBe('from-memory');
  });

  it('agrees with the metric form of the rule, 2 461 V/cm for FRP in service (1910.269(j)(2))', () => {
    expectWithin(hotStickTestVoltage({ lengthM: 1, material: 'frp', test: 'in-service' }).testVoltageV, 246.1e3);
  });

  it('rejects an unknown material, naming the field', () => {
    expect(catchHvInputError(() => hotStickTestVoltage({ lengthM: 1, material: 'glass' as 'frp', test: 'design' })).field).toBe('material');
  });
});

describe('nextDue (29 CFR 1910.137 retest intervals)', () => {
  it('gloves last tested 2025-01-05 are due 2025-07-05 (every 6 months, 1910.137, confirmed; domain check 30)', () => {
    const result = nextDue({ equipment: 'glove', lastTestDate: '2025-01-05' });
    expect(result.dueDate).toBe('2025-07-05');
    expect(result.intervalMonths).toBe(6);
  });

  it('blankets last tested 2025-01-05 are due 2026-01-05 (every 12 months, 1910.137, confirmed; domain check 30)', () => {
    expect(nextDue({ equipment: 'blanket', lastTestDate: '2025-01-05' }).dueDate).toBe('2026-01-05');
  });

  it('sleeves are due after 12 months (1910.137) and hot sticks after 24 (1910.269(j)(2))', () => {
    expect(nextDue({ equipment: 'sleeve', lastTestDate: '2025-03-10' }).dueDate).toBe('2026-03-10');
    expect(nextDue({ equipment: 'hot-stick', lastTestDate: '2025-03-10' }).dueDate).toBe('2027-03-10');
  });

  it('a day missing from the due month falls back to its last day, never later', () => {
    expect(nextDue({ equipment: 'glove', lastTestDate: '2025-08-31' }).dueDate).toBe('2026-02-28');
    expect(nextDue({ equipment: 'glove', lastTestDate: '2023-08-31' }).dueDate).toBe('2024-02-29');
    expect(addCalendarMonths({ date: '2024-02-29', months: 12 })).toBe('2025-02-28');
  });

  it('carries over the year end', () => {
    expect(nextDue({ equipment: 'glove', lastTestDate: '2025-09-15' }).dueDate).toBe('2026-03-15');
  });

  it.each(['2025-02-30', '2025-13-01', '2025-1-5', '05/01/2025', '2025-01-05T00:00:00Z', ''])('rejects %p, naming lastTestDate', (lastTestDate) => {
    expect(catchHvInputError(() => nextDue({ equipment: 'glove', lastTestDate })).field).toBe('lastTestDate');
  });

  it('rejects an unknown equipment kind', () => {
    expect(catchHvInputError(() => nextDue({ equipment: 'boots' as 'glove', lastTestDate: '2025-01-05' })).field).toBe('equipment');
  });

  it('counts an item as overdue only after its due date', () => {
    expect(isOverdue({ dueDate: '2025-07-05', onDate: '2025-07-05' })).toBe(false);
    expect(isOverdue({ dueDate: '2025-07-05', onDate: '2025-07-06' })).toBe(true);
    expect(isOverdue({ dueDate: '2025-07-05', onDate: '2024-12-31' })).toBe(false);
  });
});
