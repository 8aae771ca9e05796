import { formatQuantity, type QuantityKind } from '@shuntwise/contracts';

export interface QuantityProps {
  /** The value in SI units (V, A, Ω, W, °C, K/W, V/K, %/K). */
  value: number | null | undefined;
  kind: QuantityKind;
  /** Significant digits (default 3). */
  digits?: number;
  /** Text for a missing value (default an en dash). */
  empty?: string;
}

/**
 * The one way a physical number reaches the screen: engineering prefix and unit from
 * the shared formatter (4.70 V, 250 µA, 33.0 Ω, −1.90 mV/K), figures of equal width so
 * columns line up, and the exact SI value on hover.
 */
export function Quantity({ value, kind, digits, empty }: QuantityProps) {
  const text = formatQuantity(value, kind, { digits, empty });
  const exact = value === null || value === undefined || Number.isNaN(value) ? undefined : String(value);
  return (
    <span style={{ fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' }} title={exact} data-si={exact}>
      {text}
    </span>
  );
}
