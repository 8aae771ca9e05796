import { Badge, Group, Text, Tooltip } from '@mantine/core';
import { CARD_FIELD_META } from '@/lib/card-fields';
import type { Suggestion } from '../utils/card-draft';

/**
 * Where a suggested value came from on its page, as a small badge with a plain tooltip, so an
 * engineer knows how much to trust it: a value read from a scan (OCR) or one that was not
 * printed as such (worked out from a tolerance suffix, converted from %/K) is flagged in
 * orange and should be checked against the page first.
 */

type Origin = { label: string; tip: string; flagged: boolean };

const METHOD: Record<NonNullable<Suggestion['method']>, Omit<Origin, 'flagged'>> = {
  table: { label: 'table', tip: 'Read from a cell of a table: check it is the row of this part and the column you expect.' },
  list: { label: 'list', tip: 'Read from a list of labels and values: check the label belongs to this value.' },
  sentence: { label: 'sentence', tip: 'Read from a sentence of running text: check the sentence really states this rating for this part.' },
};

const DERIVED: Record<NonNullable<Suggestion['derived']>, Omit<Origin, 'flagged'>> = {
  'tolerance-suffix': {
    label: 'from suffix',
    tip: 'Not printed as a number: worked out from the tolerance letter in the part number and the tolerance table of the datasheet. Check both before using it.',
  },
  converted: {
    label: 'converted',
    tip: 'Not printed in this form: converted from the figure on the page (for example a %/K coefficient with the nominal Zener voltage). Check the conversion.',
  },
};

/** The badges for one suggestion, most doubtful first. Exported for the suggestion bar's count. */
export function originsOf(s: Pick<Suggestion, 'method' | 'ocr' | 'derived' | 'page' | 'note'>): Origin[] {
  const out: Origin[] = [];
  if (s.ocr) {
    out.push({
      label: 'scan',
      tip: `Page ${s.page} has no text layer: this value was read from the page image by OCR. Compare every digit, the decimal point, the sign and the unit with the page.`,
      flagged: true,
    });
  }
  if (s.derived) out.push({ ...DERIVED[s.derived], tip: `${DERIVED[s.derived].tip}${s.note ? ` (${s.note})` : ''}`, flagged: true });
  if (s.method) out.push({ ...METHOD[s.method], flagged: false });
  return out;
}

/** True when the suggestion should be looked at before it is accepted. */
export function needsCloserLook(s: Pick<Suggestion, 'ocr' | 'derived'>): boolean {
  return Boolean(s.ocr || s.derived);
}

export function SuggestionOrigin({ suggestion }: { suggestion: Suggestion }) {
  const origins = originsOf(suggestion);
  if (!origins.length) return null;
  return (
    <Group gap={2} wrap="nowrap" data-testid={`origin-${suggestion.field}`}>
      {origins.map((o) => (
        <Tooltip key={o.label} label={o.tip} multiline maw={320}>
          <Badge
            size="xs"
            radius="sm"
            variant={o.flagged ? 'filled' : 'outline'}
            color={o.flagged ? 'orange' : 'gray'}
            data-flagged={o.flagged || undefined}
            aria-label={`${o.label}: ${o.tip}`}
            tabIndex={0}
            style={{ flexShrink: 0, cursor: 'help', textTransform: 'none' }}
          >
            {o.flagged ? `check: ${o.label}` : o.label}
          </Badge>
        </Tooltip>
      ))}
    </Group>
  );
}

/** One line for the suggestion bar: which suggestions to check first, and why. Nothing when none is flagged. */
export function CheckFirstNote({ suggestions }: { suggestions: Array<Suggestion | undefined> }) {
  const flagged = suggestions.filter((s): s is Suggestion => s !== undefined && needsCloserLook(s));
  if (!flagged.length) return null;
  const items = flagged.map((s) => `${CARD_FIELD_META[s.field].symbol} (${s.ocr ? 'scan' : s.derived === 'converted' ? 'converted' : 'from suffix'})`);
  return (
    <Text fz="xs" c="orange.8" data-testid="check-first">
      Check first against the page: {items.join(', ')}
    </Text>
  );
}
