import { useEffect, useRef, useState, type FocusEvent } from 'react';
import { TextInput, type TextInputProps } from '@mantine/core';
import { formatQuantity, parseQuantity, SI_UNIT, UnitParseError, type QuantityKind } from '@shuntwise/contracts';

export interface QuantityInputProps extends Omit<TextInputProps, 'value' | 'defaultValue' | 'onChange' | 'rightSection'> {
  kind: QuantityKind;
  /** The value in SI, or null when the field is empty. */
  value: number | null;
  /**
   * Called with the SI value whenever the text changes: the number when it reads, null
   * when emptied, NaN while it does not read (so a form's number schema refuses it
   * instead of keeping the last good value).
   */
  onChange: (value: number | null) => void;
  /** Unit for a bare number, e.g. "mA" so that "4.7" means 4.7 mA; default the SI unit. */
  unit?: string;
  /** Field name used in the parse error; default the label. */
  fieldName?: string;
  /** Told whether the text currently reads, so a form can refuse to submit. */
  onValidityChange?: (valid: boolean) => void;
}

/** Shows an SI value the way it would be typed back: "4.7 mA", not "4.70 mA" (nothing is rounded off). */
export function formatForInput(value: number | null, kind: QuantityKind): string {
  if (value === null || Number.isNaN(value)) return '';
  return formatQuantity(value, kind, { digits: 12 })
    .replace(/(\.\d*?)0+(?=\s)/, '$1')
    .replace(/\.(?=\s)/, '');
}

/**
 * A text field for a physical quantity in the notation datasheets and the rest of the
 * app use: "5 mA", "0.5 µA", "0.5 uA", or a bare "4.7" in the field's unit. It stores SI
 * and, when the text does not read, says so naming the field — and keeps the text so
 * nothing typed is lost.
 */
export function QuantityInput({ kind, value, onChange, unit, fieldName, onValidityChange, label, error, onBlur, ...rest }: QuantityInputProps) {
  const fieldUnit = unit ?? SI_UNIT[kind];
  const [text, setText] = useState(() => formatForInput(value, kind));
  const [parseError, setParseError] = useState<string | null>(null);
  const [showError, setShowError] = useState(false);
  const lastEmitted = useRef<number | null>(value);
  // NaN from outside is our own "does not read" echo; Object.is(NaN, NaN) keeps the text.

  // A value set from outside (form reset, loaded record) replaces the text; our own
  // echo of what the user typed does not, so "4.7" is not rewritten while typing.
  useEffect(() => {
    if (!Object.is(value, lastEmitted.current)) {
      lastEmitted.current = value;
      setText(formatForInput(value, kind));
      setParseError(null);
    }
  }, [value, kind]);

  const read = (next: string) => {
    if (next.trim() === '') {
      setParseError(null);
      onValidityChange?.(true);
      if (lastEmitted.current !== null) {
        lastEmitted.current = null;
        onChange(null);
      }
      return;
    }
    try {
      // 12 significant figures drop the float noise of the prefix factor (5100 mV is 5.1 V, not 5.1000000000000005).
      const si = Number(
        parseQuantity(next, kind, {
          field: fieldName ?? (typeof label === 'string' ? label : 'value'),
          defaultUnit: fieldUnit,
        }).toPrecision(12),
      );
      setParseError(null);
      onValidityChange?.(true);
      if (!Object.is(si, lastEmitted.current)) {
        lastEmitted.current = si;
        onChange(si);
      }
    } catch (e) {
      if (!(e instanceof UnitParseError)) throw e;
      setParseError(e.message);
      onValidityChange?.(false);
      if (!Number.isNaN(lastEmitted.current)) {
        lastEmitted.current = NaN;
        onChange(NaN);
      }
    }
  };

  return (
    <TextInput
      {...rest}
      label={label}
      value={text}
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      rightSection={fieldUnit}
      rightSectionWidth={Math.max(36, fieldUnit.length * 9 + 16)}
      rightSectionPointerEvents="none"
      onChange={(event) => {
        const next = event.currentTarget.value;
        setText(next);
        read(next);
      }}
      onBlur={(event: FocusEvent<HTMLInputElement>) => {
        // The error waits for the blur so it does not flash while the unit is still being typed.
        setShowError(true);
        onBlur?.(event);
      }}
      error={(showError && parseError) || error}
    />
  );
}
