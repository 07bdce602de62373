// How a recorded checklist answer reads on the booking's page.
import { describeAnswer } from '../../../components/bookings/answer-words';

const line = { id: 1, text: 'Residual voltage at the output', withinLimits: true } as const;

describe('describeAnswer', () => {
  it('gives a reading with its unit and limits, and says when it was outside them', () => {
    expect(describeAnswer({ ...line, kind: 'reading', unit: 'V', max: 50, value: 3.2 })).toBe('3.2 V (at most 50 V)');
    expect(describeAnswer({ ...line, kind: 'reading', unit: 'V', max: 50, value: 120, withinLimits: false })).toBe('120 V (at most 50 V: outside)');
    expect(describeAnswer({ ...line, kind: 'reading', unit: 'MΩ', min: 10, max: 2000, value: 300 })).toBe('300 MΩ (limits 10 to 2000 MΩ)');
    expect(describeAnswer({ ...line, kind: 'reading', unit: 'mm', min: 5, value: 4, withinLimits: false })).toBe('4 mm (at least 5 mm: outside)');
    expect(describeAnswer({ ...line, kind: 'reading', value: 0.123456 })).toBe('0.1235');
  });

  it('says what was left out of optional lines', () => {
    expect(describeAnswer({ ...line, kind: 'reading', unit: 'V', max: 50 })).toBe('No reading (optional)');
    expect(describeAnswer({ ...line, kind: 'confirm' })).toBe('Not confirmed (optional)');
    expect(describeAnswer({ ...line, kind: 'photo' })).toBe('No photo (optional)');
  });

  it('names confirmations and photos', () => {
    expect(describeAnswer({ ...line, kind: 'confirm', confirmed: true })).toBe('Confirmed');
    expect(describeAnswer({ ...line, kind: 'photo', fileId: 7 })).toBe('Photo taken');
  });
});
