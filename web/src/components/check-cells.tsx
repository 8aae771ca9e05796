import { Text } from '@mantine/core';
import { formatMargin, formatNumber, type QualificationCheck, type QualificationVerdict } from '@shuntwise/contracts';
import { Quantity } from './quantity';
import { VERDICT_TEXT_COLOR } from './verdict-badge';

/** A margin in percent of the limit with its sign ("+2.1 %", "−25.0 %"): the shared formatter's. */
export { formatMargin };

/** The margin coloured by the check's verdict (the server decided the verdict; the colour only shows it). */
export function MarginText({ margin, verdict, fz = 'sm' }: { margin: number | null; verdict: QualificationVerdict; fz?: string }) {
  return (
    <Text span fz={fz} fw={600} c={VERDICT_TEXT_COLOR[verdict]} data-verdict={verdict} style={{ fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' }}>
      {formatMargin(margin)}
    </Text>
  );
}

function Num({ value, check }: { value: number | null; check: Pick<QualificationCheck, 'quantity'> }) {
  if (check.quantity === 'text') return <>–</>;
  if (check.quantity === 'ratio') {
    return <span style={{ fontVariantNumeric: 'tabular-nums' }}>{formatNumber(value)}</span>;
  }
  return <Quantity value={value} kind={check.quantity} />;
}

/** The part's normalised value: a range for window checks, the package name for the package check. */
export function CheckValue({ check }: { check: QualificationCheck }) {
  if (check.quantity === 'text') return <>{check.text?.value ?? '–'}</>;
  if (check.limitKind === 'window' && check.range && check.range.low !== check.range.high) {
    return (
      <span style={{ whiteSpace: 'nowrap' }}>
        <Num value={check.range.low} check={check} /> … <Num value={check.range.high} check={check} />
      </span>
    );
  }
  return <Num value={check.value} check={check} />;
}

/** The spec's limit as a bound, a window or the allowed list. */
export function CheckLimit({ check }: { check: QualificationCheck }) {
  switch (check.limitKind) {
    case 'member':
      return <>{check.text?.allowed.join(', ') || '–'}</>;
    case 'window':
      return check.window ? (
        <span style={{ whiteSpace: 'nowrap' }}>
          <Num value={check.window.min} check={check} /> … <Num value={check.window.max} check={check} />
        </span>
      ) : (
        <Num value={check.limit} check={check} />
      );
    case 'max':
      return (
        <span style={{ whiteSpace: 'nowrap' }}>
          ≤ <Num value={check.limit} check={check} />
        </span>
      );
    case 'min':
      return (
        <span style={{ whiteSpace: 'nowrap' }}>
          ≥ <Num value={check.limit} check={check} />
        </span>
      );
  }
}
