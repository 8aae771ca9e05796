import { useEffect, useRef, useState, type FocusEvent } from 'react';
import { TextInput, type TextInputProps } from '@mantine/core';
import { UnitParseError, type TempCoUnit } from '@shuntwise/contracts';
import { parseTempCo, type TempCoValue } from '@/lib/card-fields';

export interface TempCoInputProps extends Omit<TextInputProps, 'value' | 'defaultValue' | 'onChange' | 'rightSection'> {
  /** The coefficient in the unit the card keeps (mV/K or %/K), or null when empty. */
  value: TempCoValue | null;
  /** The value; `{value: NaN}` while the text does not read, null when emptied. */
  onChange: (value: TempCoValue | null) => void;
  /** Unit of a bare number (default mV/K). */
  bareUnit?: TempCoUnit;
  fieldName?: string;
}

export function formatTempCoForInput(value: TempCoValue | null): string {
  if (!value || Number.isNaN(value.value)) return '';
  return `${Number(value.value.toPrecision(12))} ${value.unit}`;
}

function same(a: TempCoValue | null, b: TempCoValue | null): boolean {
  if (a === null || b === null) return a === b;
  return Object.is(a.value, b.value) && a.unit === b.unit;
}

/**
 * The temperature coefficient as datasheets print it, in either of its two units:
 * "-2.5 mV/K", "-2.5 mV/°C", "0.06 %/K". Like QuantityInput it keeps what was typed
 * when it does not read and names the field in the error.
 */
export function TempCoInput({ value, onChange, bareUnit = 'mV/K', fieldName, label, error, onBlur, ...rest }: TempCoInputProps) {
  const [text, setText] = useState(() => formatTempCoForInput(value));
  const [parseError, setParseError] = useState<string | null>(null);
  const [showError, setShowError] = useState(false);
  const lastEmitted = useRef<TempCoValue | null>(value);

  useEffect(() => {
    if (!same(value, lastEmitted.current)) {
      lastEmitted.current = value;
      setText(formatTempCoForInput(value));
      setParseError(null);
    }
  }, [value]);

  const emit = (next: TempCoValue | null) => {
    if (same(next, lastEmitted.current)) return;
    lastEmitted.current = next;
    onChange(next);
  };

  const read = (next: string) => {
    if (next.trim() === '') {
      setParseError(null);
      emit(null);
      return;
    }
    try {
      const parsed = parseTempCo(next, bareUnit, fieldName ?? (typeof label === 'string' ? label : 'αVZ'));
      setParseError(null);
      emit(parsed);
    } catch (e) {
      if (!(e instanceof UnitParseError)) throw e;
      setParseError(e.message);
      emit({ value: NaN, unit: lastEmitted.current?.unit ?? bareUnit });
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
      rightSection={value?.unit ?? bareUnit}
      rightSectionWidth={52}
      rightSectionPointerEvents="none"
      onChange={(event) => {
        const next = event.currentTarget.value;
        setText(next);
        read(next);
      }}
      onBlur={(event: FocusEvent<HTMLInputElement>) => {
        setShowError(true);
        onBlur?.(event);
      }}
      error={(showError && parseError) || error}
    />
  );
}
