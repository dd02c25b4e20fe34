import { CONTRACT_PRESETS, type ContractRules } from '@rotaplex/contracts';
import {
  describeRules,
  formatPerTypeLimits,
  loosenedRestRules,
  parsePerTypeLimits,
  RULE_HELP,
  ruleInputs,
  rulesFromInputs,
} from './contractRules';

const EU = CONTRACT_PRESETS.find((p) => p.key === 'eu-wtd')!;

describe('contract rules in the form', () => {
  it('shows the EU Working Time Directive preset in hours: 11 h daily rest, 48 h a week, 6 days in a row', () => {
    // Directive 2003/88/EC: Art. 3 (11 consecutive hours of daily rest), Art. 6 (48-hour week),
    // Art. 5 (24 h weekly rest in each 7 days, so at most 6 working days in a row).
    const inputs = ruleInputs(EU.rules);
    expect(inputs.minRestMinutes).toBe('11');
    expect(inputs.maxPaidMinutes).toBe('48');
    expect(inputs.maxConsecutiveWorkDays).toBe('6');
    expect(inputs.maxWeekends).toBe('');
  });

  it('stores typed hours as minutes, including half hours (22.5 h = 1350 min)', () => {
    const inputs = ruleInputs({});
    const { rules, errors } = rulesFromInputs({
      ...inputs,
      targetPaidMinutes: '22.5',
      minRestMinutes: '11',
      maxConsecutiveNights: '3',
    });
    expect(errors).toEqual({});
    expect(rules.targetPaidMinutes).toBe(1350);
    expect(rules.minRestMinutes).toBe(660);
    expect(rules.maxConsecutiveNights).toBe(3);
    expect(rules.maxPaidMinutes).toBeNull();
  });

  it('reads a decimal comma as people type it in much of Europe (common practice)', () => {
    expect(rulesFromInputs({ ...ruleInputs({}), targetPaidMinutes: '37,5' }).rules.targetPaidMinutes).toBe(
      2250,
    );
  });

  it('names each box it cannot read, and refuses fewest hours above most hours', () => {
    const { errors } = rulesFromInputs({
      ...ruleInputs({}),
      minRestMinutes: 'eleven',
      maxConsecutiveWorkDays: '2.5',
      minPaidMinutes: '40',
      maxPaidMinutes: '30',
    });
    expect(Object.keys(errors).sort()).toEqual([
      'maxConsecutiveWorkDays',
      'minPaidMinutes',
      'minRestMinutes',
    ]);
  });

  it('has plain-words help for every rule except the per-shift-type limit', () => {
    expect(RULE_HELP.map((r) => r.field).sort()).toEqual(
      [
        'minPaidMinutes',
        'maxPaidMinutes',
        'targetPaidMinutes',
        'maxConsecutiveWorkDays',
        'minConsecutiveWorkDays',
        'minConsecutiveDaysOff',
        'maxWeekends',
        'maxConsecutiveNights',
        'minRestMinutes',
      ].sort(),
    );
    for (const r of RULE_HELP) expect(r.help.length).toBeGreaterThan(20);
  });
});

describe('rules that contradict each other', () => {
  it('keeps the contracted hours between the fewest and the most, and runs of days in order', () => {
    const base = ruleInputs({});
    expect(
      rulesFromInputs({ ...base, minPaidMinutes: '30', targetPaidMinutes: '22.5' }).errors.minPaidMinutes,
    ).toMatch(/contracted/);
    expect(
      rulesFromInputs({ ...base, targetPaidMinutes: '50', maxPaidMinutes: '48' }).errors.targetPaidMinutes,
    ).toMatch(/most hours/);
    expect(
      rulesFromInputs({ ...base, minConsecutiveWorkDays: '4', maxConsecutiveWorkDays: '3' }).errors
        .minConsecutiveWorkDays,
    ).toMatch(/days in a row/);
    // The demo's full-time contract (37.5 h between 30 h and 48 h) is consistent.
    expect(
      rulesFromInputs({ ...base, minPaidMinutes: '30', targetPaidMinutes: '37.5', maxPaidMinutes: '48' })
        .errors,
    ).toEqual({});
  });
});

describe('fatigue warning', () => {
  it('warns when daily rest drops below the preset: 10 h, as some US fair workweek laws allow, is under the EU 11 h', () => {
    // Seattle SMC 14.22 and Oregon SB 828 use 10 h rest; Directive 2003/88/EC Art. 3 sets 11 h.
    const rules: Partial<ContractRules> = { ...EU.rules, minRestMinutes: 600 };
    expect(loosenedRestRules(rules, EU.rules).map((r) => r.field)).toEqual(['minRestMinutes']);
  });

  it('warns when a rest rule is removed or a maximum run is raised, not when a rule is tightened', () => {
    expect(
      loosenedRestRules({ ...EU.rules, minRestMinutes: null, maxConsecutiveWorkDays: 7 }, EU.rules)
        .map((r) => r.field)
        .sort(),
    ).toEqual(['maxConsecutiveWorkDays', 'minRestMinutes']);
    expect(
      loosenedRestRules({ ...EU.rules, minRestMinutes: 720, maxConsecutiveWorkDays: 5 }, EU.rules),
    ).toEqual([]);
  });

  it('does not warn about hours limits, which are not rest rules', () => {
    expect(loosenedRestRules({ ...EU.rules, maxPaidMinutes: null }, EU.rules)).toEqual([]);
  });
});

describe('contract summary', () => {
  it('states the main limits of the EU preset in hours', () => {
    expect(describeRules(EU.rules)).toBe(
      'at most 48 h a week · 11 h rest between shifts · at most 6 days in a row',
    );
  });
});

describe('most shifts of each type a week', () => {
  it('reads codes with counts in either common notation and writes them back sorted', () => {
    expect(parsePerTypeLimits('n 2; L:5')).toEqual({ limits: { N: 2, L: 5 } });
    expect(parsePerTypeLimits('N 0')).toEqual({ limits: { N: 0 } });
    expect(parsePerTypeLimits('  ')).toEqual({ limits: null });
    expect(formatPerTypeLimits({ N: 2, L: 5 })).toBe('L 5; N 2');
    expect(formatPerTypeLimits(null)).toBe('');
  });

  it('refuses what it cannot read and a code given twice', () => {
    expect(parsePerTypeLimits('nights 2').error).toMatch(/"nights 2"/);
    expect(parsePerTypeLimits('N 2; n 3').error).toMatch(/N appears twice/);
    // One shift per person per day (PRODUCT.md hard rule), so a week holds at most 7.
    expect(parsePerTypeLimits('E 8').error).toMatch(/at most 7/);
  });
});
