import { ruleInWords } from './open-shift-words';

describe('a rule finding as a reason a person may not take a shift', () => {
  it('drops the name, speaks to the person, gives dates in words and no "(s)"', () => {
    // Gregorian calendar: 10 March 2027 is a Wednesday.
    expect(
      ruleInWords(
        { rule: 'absence', message: 'Robin Tallis is unavailable on 2027-03-10 but has shift E' },
        'Robin Tallis',
      ),
    ).toBe('Leave or unavailability: you are unavailable on Wed 10 Mar 2027 but would have shift E');
    expect(
      ruleInWords(
        {
          rule: 'minConsecutiveDaysOff',
          message: 'Robin Tallis: only 1 day(s) off in a row from 2027-03-09 (at least 2)',
        },
        'Robin Tallis',
      ),
    ).toBe('Days off in a row: only 1 day off in a row from Tue 9 Mar 2027 (at least 2)');
  });
  it('names an unknown rule plainly and leaves other names alone', () => {
    expect(
      ruleInWords({ rule: 'somethingNew', message: 'Grace Holloway works too much' }, 'Robin Tallis'),
    ).toBe('A rule of your contract: Grace Holloway works too much');
  });
});
