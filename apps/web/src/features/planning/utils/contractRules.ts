import { type CONTRACT_RULE_FIELDS, type ContractRules } from '@rotaplex/contracts';

type ScalarRule = Exclude<(typeof CONTRACT_RULE_FIELDS)[number], 'maxShiftsPerType'>;

export interface RuleHelp {
  field: ScalarRule;
  label: string;
  /** What the rule means, in plain words. */
  help: string;
  /** How the number is typed: hours (stored as minutes) or a count. */
  unit: 'hours' | 'count';
  /** Rest rules: lowering or removing them carries a fatigue risk. */
  rest?: boolean;
}

/** Every scalar rule of a contract with plain-words help. Quantities are per week, weekends per 4 weeks. */
export const RULE_HELP: readonly RuleHelp[] = [
  {
    field: 'targetPaidMinutes',
    label: 'Contracted hours a week',
    help: 'The paid hours the person is contracted for. The roster tries to come close; it is a goal, not a limit.',
    unit: 'hours',
  },
  {
    field: 'minPaidMinutes',
    label: 'Fewest paid hours a week',
    help: 'The roster gives the person at least this many paid hours in each week of the period, on average.',
    unit: 'hours',
  },
  {
    field: 'maxPaidMinutes',
    label: 'Most paid hours a week',
    help: 'The roster never gives more paid hours than this per week of the period, overtime included.',
    unit: 'hours',
  },
  {
    field: 'minRestMinutes',
    label: 'Rest between shifts (hours)',
    help: 'Time off between the end of one shift and the start of the next, worked out from the shift times, across midnight.',
    unit: 'hours',
    rest: true,
  },
  {
    field: 'maxConsecutiveWorkDays',
    label: 'Most working days in a row',
    help: 'After this many days with a shift, the next day is off.',
    unit: 'count',
    rest: true,
  },
  {
    field: 'minConsecutiveWorkDays',
    label: 'Fewest working days in a row',
    help: 'Avoids single working days between days off: each run of work is at least this long.',
    unit: 'count',
  },
  {
    field: 'minConsecutiveDaysOff',
    label: 'Fewest days off in a row',
    help: 'Each run of days off is at least this long, so time off is usable.',
    unit: 'count',
    rest: true,
  },
  {
    field: 'maxWeekends',
    label: 'Most weekends worked in 4 weeks',
    help: 'A weekend counts as worked when the person has any shift on the Saturday or the Sunday.',
    unit: 'count',
  },
  {
    field: 'maxConsecutiveNights',
    label: 'Most night shifts in a row',
    help: 'Limits runs of night shifts; a shift is a night when at least 3 hours of it fall between midnight and 05:00 unless the shift type says otherwise.',
    unit: 'count',
    rest: true,
  },
];

/** The text typed in each rule's box ('' = no such rule). */
export type RuleInputs = Record<ScalarRule, string>;

export function ruleInputs(rules: Partial<ContractRules>): RuleInputs {
  const out = {} as RuleInputs;
  for (const r of RULE_HELP) {
    const v = rules[r.field];
    out[r.field] = v === null || v === undefined ? '' : r.unit === 'hours' ? String(v / 60) : String(v);
  }
  return out;
}

/** Rules as the API stores them (minutes for hours), with a message per box that cannot be read. */
export function rulesFromInputs(inputs: RuleInputs): {
  rules: Omit<ContractRules, 'maxShiftsPerType'>;
  errors: Partial<Record<ScalarRule, string>>;
} {
  const rules = {} as Omit<ContractRules, 'maxShiftsPerType'>;
  const errors: Partial<Record<ScalarRule, string>> = {};
  for (const r of RULE_HELP) {
    const text = inputs[r.field].trim().replace(',', '.');
    if (text === '') {
      rules[r.field] = null;
      continue;
    }
    const n = Number(text);
    if (r.unit === 'hours') {
      // Minutes are whole numbers; hours may have up to two decimals (22.5 h = 1350 min).
      if (!/^\d+(\.\d{1,2})?$/.test(text) || n > 168) {
        errors[r.field] = 'Enter hours from 0 to 168, for example 37.5.';
        continue;
      }
      rules[r.field] = Math.round(n * 60);
    } else {
      if (!/^\d{1,2}$/.test(text)) {
        errors[r.field] = 'Enter a whole number from 0 to 99.';
        continue;
      }
      rules[r.field] = n;
    }
  }
  // The same cross-field checks as the API, worded for the boxes they concern.
  const above = (a: ScalarRule, b: ScalarRule, message: string) => {
    const x = rules[a];
    const y = rules[b];
    if (x !== null && y !== null && x > y && !errors[a] && !errors[b]) errors[a] = message;
  };
  above('minPaidMinutes', 'maxPaidMinutes', 'The fewest hours cannot be more than the most hours.');
  above('minPaidMinutes', 'targetPaidMinutes', 'The fewest hours cannot be more than the contracted hours.');
  above('targetPaidMinutes', 'maxPaidMinutes', 'The contracted hours cannot be more than the most hours.');
  above(
    'minConsecutiveWorkDays',
    'maxConsecutiveWorkDays',
    'The fewest days in a row cannot be more than the most days in a row.',
  );
  return { rules, errors };
}

/**
 * Rest rules a contract loosens against a baseline (the preset it came from, or the saved contract): removed or set below the preset's value
 * (for a maximum run, set above it). The screen shows a fatigue warning for each.
 */
export function loosenedRestRules(rules: Partial<ContractRules>, base: ContractRules): RuleHelp[] {
  return RULE_HELP.filter((r) => {
    if (!r.rest) return false;
    const before = base[r.field];
    if (before === null) return false;
    const after = rules[r.field];
    if (after === null || after === undefined) return true;
    const isMaximum = r.field === 'maxConsecutiveWorkDays' || r.field === 'maxConsecutiveNights';
    return isMaximum ? after > before : after < before;
  });
}

/** "11 h rest · at most 6 days in a row · 48 h a week at most" for a list row. */
export function describeRules(rules: ContractRules): string {
  const parts: string[] = [];
  const h = (m: number) => `${Number((m / 60).toFixed(2))} h`;
  if (rules.targetPaidMinutes !== null) parts.push(`${h(rules.targetPaidMinutes)} a week contracted`);
  if (rules.maxPaidMinutes !== null) parts.push(`at most ${h(rules.maxPaidMinutes)} a week`);
  if (rules.minRestMinutes !== null) parts.push(`${h(rules.minRestMinutes)} rest between shifts`);
  if (rules.maxConsecutiveWorkDays !== null)
    parts.push(`at most ${rules.maxConsecutiveWorkDays} days in a row`);
  if (rules.maxWeekends !== null) parts.push(`at most ${rules.maxWeekends} weekends in 4 weeks`);
  if (rules.maxConsecutiveNights !== null)
    parts.push(`at most ${rules.maxConsecutiveNights} nights in a row`);
  return parts.length ? parts.join(' · ') : 'No rules set';
}

/** "N 2; L 5" for a per-shift-type limit (codes in alphabetical order); '' for none. */
export function formatPerTypeLimits(limits: Record<string, number> | null): string {
  if (!limits) return '';
  return Object.keys(limits)
    .sort()
    .map((code) => `${code} ${limits[code]}`)
    .join('; ');
}

/**
 * Reads "N 2; L 5" (also "N:2, L:5") into { N: 2, L: 5 }: shift type codes (1-4 capital letters or
 * digits, as shift types use) each with a whole number of shifts a week, 0-7. Empty text is no limit (null).
 */
export function parsePerTypeLimits(text: string): { limits: Record<string, number> | null; error?: string } {
  const parts = text
    .split(/[;,]/)
    .map((p) => p.trim())
    .filter(Boolean);
  if (parts.length === 0) return { limits: null };
  const limits: Record<string, number> = {};
  for (const part of parts) {
    const m = /^([A-Za-z0-9]{1,4})\s*[: ]\s*(\d{1,2})$/.exec(part);
    if (!m)
      return {
        limits: null,
        error: `Write each limit as a shift code and a number, e.g. "N 2"; "${part}" is not.`,
      };
    const code = m[1].toUpperCase();
    if (code in limits) return { limits: null, error: `The shift code ${code} appears twice.` };
    // A week has 7 days and a person works at most one shift a day.
    if (Number(m[2]) > 7) return { limits: null, error: `${code}: at most 7 shifts fit in a week.` };
    limits[code] = Number(m[2]);
  }
  return { limits };
}
