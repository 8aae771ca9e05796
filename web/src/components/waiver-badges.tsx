import { Badge, Group, Tooltip } from '@mantine/core';
import { CHECK_LABELS, formatQuantity, type WaiverBrief } from '@shuntwise/contracts';

function limitText(w: WaiverBrief): string {
  if (w.acceptedLimit === null) return 'as stated';
  if (w.quantity === 'ratio' || w.quantity === 'text') return String(w.acceptedLimit);
  return formatQuantity(w.acceptedLimit, w.quantity);
}

/**
 * The waivers a standing rests on, each with its expiry: designers and buyers see that the
 * source is usable only on them, and until when. Nothing when there are none.
 */
export function WaiverBadges({ waivers }: { waivers: readonly WaiverBrief[] }) {
  if (waivers.length === 0) return null;
  return (
    <Group gap={4} wrap="wrap">
      {waivers.map((w) => (
        <Tooltip key={w.id} label={`${CHECK_LABELS[w.checkId]} waived: accepted ${limitText(w)}, ${w.state === 'lapsed' ? 'expired' : 'until'} ${w.expiresOn}`}>
          <Badge size="xs" color={w.state === 'lapsed' ? 'orange' : 'yellow'} variant="outline" data-testid="waiver-badge">
            {w.state === 'lapsed' ? 'waiver expired' : 'waiver until'} {w.expiresOn}
          </Badge>
        </Tooltip>
      ))}
    </Group>
  );
}
