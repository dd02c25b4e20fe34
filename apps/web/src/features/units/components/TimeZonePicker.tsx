import { useMemo, useState } from 'react';
import { Combobox, Field, Option } from '@fluentui/react-components';
import { allTimeZones, filterTimeZones, utcOffset } from '@/features/units/timeZones';

export interface TimeZonePickerProps {
  value: string;
  onChange: (timeZone: string) => void;
  error?: string;
}

/** Type to narrow the IANA list ("lond", "new york"); pick with arrows and Enter. */
export function TimeZonePicker({ value, onChange, error }: TimeZonePickerProps) {
  const zones = useMemo(allTimeZones, []);
  const [query, setQuery] = useState(value);
  const [open, setOpen] = useState(false);
  const options = useMemo(() => filterTimeZones(zones, query === value ? '' : query), [zones, query, value]);

  return (
    <Field
      label="Time zone"
      required
      hint="Shift times in this unit are in this zone, including clock changes."
      validationMessage={error}
      validationState={error ? 'error' : 'none'}
    >
      <Combobox
        freeform
        value={query}
        selectedOptions={value ? [value] : []}
        open={open}
        onOpenChange={(_, data) => setOpen(data.open)}
        placeholder="Start typing a city, e.g. London"
        onChange={(event) => {
          setQuery(event.target.value);
          setOpen(true);
        }}
        onOptionSelect={(_, data) => {
          if (data.optionValue) {
            onChange(data.optionValue);
            setQuery(data.optionValue);
          }
        }}
        // Typing replaces the current zone rather than appending to it.
        onFocus={(event) => event.target.select()}
        onBlur={() => setQuery(value)}
      >
        {options.map((zone) => (
          <Option key={zone} value={zone} text={zone}>
            {`${zone.replace(/_/g, ' ')} (${utcOffset(zone)})`}
          </Option>
        ))}
        {options.length === 0 && (
          <Option disabled value="" text="">
            No time zone matches
          </Option>
        )}
      </Combobox>
    </Field>
  );
}
