// The Planner's calculators from typed text to shown values. Expected values are the check values
// of the domain brief (/work/shared/domain.md §9), which shared/hv's own tests also cite.
import { CALCULATORS, initialState } from '../../../components/planner/calculators';
import { parseDecimal } from '../../../components/planner/calculators/read-inputs';
import type { CalcState, CalcView, CalculatorName } from '../../../components/planner/calculators/types';
import { notebookText } from '../../../components/planner/notebook-text';

function calc(name: CalculatorName) {
  const found = CALCULATORS.find((c) => c.name === name);
  if (!found) throw new Error(name);
  return found;
}

function run(
  name: CalculatorName,
  fields: Record<string, string | [string, string]>,
  choices: Record<string, string> = {},
): { view: CalcView; state: CalcState } {
  const def = calc(name);
  const state = initialState(def);
  for (const [key, value] of Object.entries(fields)) {
    const [text, unit] = Array.isArray(value) ? value : [value, state.fields[key]!.unit];
    state.fields[key] = { text, unit };
  }
  Object.assign(state.choices, choices);
  return { view: def.compute(state), state };
}

function value(view: CalcView, key: string): string | undefined {
  for (const section of view.sections) {
    const line = section.lines.find((l) => l.key === key);
    if (line) return line.value;
  }
  return undefined;
}

describe('parseDecimal', () => {
  it.each([
    ['4.7', 4.7],
    ['4,7', 4.7],
    [' 1e-9 ', 1e-9],
    ['.5', 0.5],
    ['-2', -2],
  ])('reads %p', (text, expected) => {
    expect(parseDecimal(text)).toEqual({ kind: 'number', value: expected });
  });

  it.each(['abc', '1.2.3', '1e', '--1', '4,7,1', 'NaN', 'Infinity'])('refuses %p', (text) => {
    expect(parseDecimal(text)).toEqual({ kind: 'invalid' });
  });

  it('treats blank as empty, not zero', () => {
    expect(parseDecimal('   ')).toEqual({ kind: 'empty' });
  });
});

describe('stored energy and discharge', () => {
  it('gives 50 J, 10 mC, 529.8 s and the 5τ warning for 1 µF at 10 kV through 100 MΩ (§9 #1–#4)', () => {
    const { view } = run('energy', { capacitance: ['1', 'uF'], voltage: '10', bleeder: '100' });
    expect(view.errors).toEqual({});
    expect(value(view, 'energy')).toBe('50 J');
    expect(value(view, 'charge')).toBe('10 mC');
    expect(value(view, 'time-to-safe')).toBe('529.8 s (8.8 min)');
    expect(value(view, 'time-constants')).toBe('5.30 τ');
    expect(value(view, 'residual-5tau')).toBe('67.4 V');
    expect(value(view, 'bleeder-power')).toBe('1 W');
    const notice = view.sections[1]!.notices.find((n) => n.key === 'five-tau');
    expect(notice).toMatchObject({ level: 'warning', title: '5τ is not enough' });
  });

  it('shows energy alone and says what the discharge still needs', () => {
    const { view } = run('energy', { capacitance: '4.7', voltage: '30' });
    expect(value(view, 'energy')).toBe('2.12 J');
    expect(view.sections[1]!.waiting).toBe('Enter the bleeder resistance to see how long the bleeder takes.');
    expect(view.errors).toEqual({});
  });

  it('puts the shared schema’s messages under the right fields, in the field’s own terms', () => {
    expect(run('energy', { capacitance: '-1', voltage: '10' }).view.errors).toEqual({ capacitance: 'Must be more than 0' });
    expect(run('energy', { capacitance: 'x', voltage: '10' }).view.errors).toEqual({ capacitance: 'Enter a number, e.g. 4.7' });
    const { view } = run('energy', { capacitance: '1', voltage: '0.02', bleeder: '100' });
    expect(view.errors).toEqual({ safe: 'The safe voltage must be below the initial voltage' });
    expect(value(view, 'energy')).toBe('200 nJ');
  });

  it('refuses a result out of range instead of showing Infinity', () => {
    const { view } = run('energy', { capacitance: ['1e300', 'uF'], voltage: ['1e300', 'V'] });
    expect(view.errors.voltage).toBe('Charged to is too large: the result is out of range');
    expect(JSON.stringify(view)).not.toMatch(/NaN|Infinity/);
  });
});

describe('hazardous live', () => {
  it('calls 10 kV, 0.1 mA, 5 nF hazardous on the 45 µC line (§9 #6, #8)', () => {
    const { view } = run('hazard', { voltage: '10', current: '0.1', capacitance: '5' });
    expect(value(view, 'hazardous')).toBe('Hazardous live');
    expect(value(view, 'criterion')).toBe('Charge above 45 µC (Figure 3 line A)');
    expect(value(view, 'max-capacitance')).toBe('4.5 nF');
    expect(view.sections[0]!.notices[0]!.level).toBe('danger');
  });

  it('keeps a non-hazardous node above 70 V a caution, not a safe condition (§9 #7)', () => {
    const { view } = run('hazard', { voltage: '30', current: '0.1', capacitance: '0.5' });
    expect(value(view, 'hazardous')).toBe('Not hazardous live');
    expect(view.sections[0]!.notices[0]!.level).toBe('caution');
  });
});

describe('approach boundaries', () => {
  it('gives 500 V DC as 1.0 m fixed, printed 3 ft 6 in (§9 #10)', () => {
    expect(value(run('boundaries', { voltage: ['500', 'V'] }).view, 'limited-fixed')).toBe('1.0 m');
    const imperial = run('boundaries', { voltage: ['500', 'V'] }, { display: 'imperial' }).view;
    expect(value(imperial, 'limited-fixed')).toBe('3 ft 6 in');
    expect(value(imperial, 'restricted')).toBe('1 ft 0 in');
  });

  it('takes the more protective row at the 5 kV edge (§9 #12)', () => {
    expect(value(run('boundaries', { voltage: '5' }).view, 'restricted')).toBe('0.7 m');
  });

  it('says the table sets nothing below 50 V DC (§9 #14)', () => {
    const { view } = run('boundaries', { voltage: ['40', 'V'] });
    expect(view.sections[0]!.notices.map((n) => n.key)).toContain('not-specified');
    expect(value(view, 'limited-fixed')).toBe('Not specified');
  });

  it('gives 208 V AC from the AC table (§9 #15)', () => {
    expect(value(run('boundaries', { voltage: ['208', 'V'] }, { system: 'ac' }).view, 'limited-fixed')).toBe('1.0 m');
  });
});

describe('multiplier', () => {
  it('gives the kHz lab cascade (§9 #16, #18)', () => {
    const { view } = run('multiplier', { stages: '5', peakInput: '10', frequency: '50', stageCapacitance: '1', load: '1' });
    expect(value(view, 'no-load')).toBe('100 kV');
    expect(value(view, 'drop')).toBe('1.9 kV');
    expect(value(view, 'ripple')).toBe('300 V');
    expect(value(view, 'loaded')).toBe('98.1 kV');
    expect(value(view, 'optimum-stages')).toBe('22.4');
    expect(value(view, 'output-energy')).toBe('1 J');
    expect(value(view, 'stack-energy')).toBe('1.85 J');
  });

  it('gives the mains teaching set (§9 #17)', () => {
    const { view } = run('multiplier', { stages: '3', peakInput: '20', frequency: ['50', 'Hz'], stageCapacitance: ['0.1', 'uF'], load: '1' });
    expect(value(view, 'no-load')).toBe('120 kV');
    expect(value(view, 'drop')).toBe('4.4 kV');
    expect(value(view, 'ripple')).toBe('1.2 kV');
    expect(value(view, 'optimum-stages')).toBe('10.0');
  });

  it('asks for a whole number of stages and flags an overloaded cascade', () => {
    expect(run('multiplier', { stages: '2.5', peakInput: '10', frequency: '50', stageCapacitance: '1', load: '1' }).view.errors).toEqual({
      stages: 'Enter a whole number',
    });
    const overloaded = run('multiplier', { stages: '20', peakInput: '1', frequency: ['50', 'Hz'], stageCapacitance: '1', load: '1' }).view;
    expect(overloaded.sections[0]!.notices.map((n) => n.key)).toContain('overloaded');
  });
});

describe('corona onset', () => {
  it('gives Peek’s gradient and the coaxial onset (§9 #19–#21)', () => {
    const { view } = run('corona', { wireRadius: '0.1', outerRadius: ['2.54', 'cm'] });
    expect(value(view, 'density-factor')).toBe('1.000');
    expect(value(view, 'onset-gradient')).toBe('120.3 kV/cm');
    expect(value(view, 'onset-voltage')).toBe('6.66 kV');
  });

  it('refuses a collector inside the wire with the schema’s message', () => {
    expect(run('corona', { wireRadius: '2', outerRadius: ['1', 'mm'] }).view.errors).toEqual({
      outerRadius: 'The outer radius must be larger than the wire radius',
    });
  });
});

describe('notebook text', () => {
  it('carries the inputs with units, each result with its formula, the source and the caution', () => {
    const { view, state } = run('energy', { capacitance: ['1', 'uF'], voltage: '10', bleeder: '100' });
    const text = notebookText(calc('energy'), state, view, 'Caution text.', new Date('2026-03-04T05:06:00Z'));
    expect(text).toContain('Computed 2026-03-04 05:06 UTC');
    expect(text).toContain('  Capacitance: 1 µF');
    expect(text).toContain('  Safe to touch at: 50 V');
    expect(text).toContain('  Stored energy: 50 J   [E = ½CV²]');
    expect(text).toContain('! 5τ is not enough');
    expect(text).toContain('Source: E = ½CV², Q = CV (textbook electrostatics)');
    expect(text.endsWith('Caution: Caution text.')).toBe(true);
  });
});
