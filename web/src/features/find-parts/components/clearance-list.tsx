import { Anchor, Badge, Group, Stack, Text, Tooltip } from '@mantine/core';
import {
  CLEARANCE_STANDING_LABELS,
  QUALIFICATION_STATE_LABELS,
  type Clearance,
  type ClearanceStanding,
  type RuledOut,
  type SearchItem,
} from '@shuntwise/contracts';
import { Link } from 'react-router';
import { WaiverBadges } from '@/components/waiver-badges';
import { formatDate } from '../utils/format';

export const STANDING_COLOR: Record<ClearanceStanding, string> = {
  approved: 'verdigris',
  cleared: 'verdigris',
  'cleared-with-conditions': 'yellow',
  'cleared-with-waiver': 'orange',
};

function HousePartName({ clearance, linkHouseParts }: { clearance: Pick<Clearance, 'housePart'>; linkHouseParts: boolean }) {
  const { housePart } = clearance;
  const name = linkHouseParts ? (
    <Anchor component={Link} to={`/house-parts/${housePart.id}`} fz="xs" fw={500}>
      {housePart.partNumber}
    </Anchor>
  ) : (
    <Text span fz="xs" fw={500}>
      {housePart.partNumber}
    </Text>
  );
  return (
    <Tooltip label={housePart.description || housePart.partNumber} withArrow openDelay={300} multiline maw={320}>
      <span>{name}</span>
    </Tooltip>
  );
}

/** For each house part: why the part may be designed in, on what conditions, since when. */
export function ClearanceList({ item, linkHouseParts }: { item: SearchItem; linkHouseParts: boolean }) {
  if (!item.cleared) {
    return (
      <Stack gap={2}>
        <Group gap={4}>
          <Badge color="gray" variant="outline" size="sm">
            Not cleared
          </Badge>
          {item.qualificationOpen && (
            <Badge color="blue" variant="light" size="sm">
              qualification under way
            </Badge>
          )}
        </Group>
        <Text fz="xs" c="dimmed">
          Not for new designs until a component engineer clears it.
        </Text>
        <RuledOutList ruledOut={item.ruledOut} linkHouseParts={linkHouseParts} />
      </Stack>
    );
  }
  return (
    <Stack gap={4}>
      {item.clearances.map((c) => (
        <Stack key={c.housePart.id} gap={0}>
          <Group gap={4} wrap="wrap">
            <Badge color={STANDING_COLOR[c.standing]} size="sm" variant={c.standing === 'approved' ? 'outline' : 'light'}>
              {CLEARANCE_STANDING_LABELS[c.standing]}
            </Badge>
            <Text span fz="xs" c="dimmed">
              for
            </Text>
            <HousePartName clearance={c} linkHouseParts={linkHouseParts} />
            <Text span fz="xs" c="dimmed">
              since {formatDate(c.since)}
            </Text>
            {c.housePart.status !== 'active' && (
              <Badge color="orange" size="xs" variant="outline">
                {c.housePart.status.replace(/-/g, ' ')}
              </Badge>
            )}
            {c.needsRecheck && (
              <Tooltip label="The catalogue changed since the decision; an engineer is to re-check it." withArrow>
                <Badge color="orange" size="xs">
                  re-check due
                </Badge>
              </Tooltip>
            )}
            {c.recheckOpen && (
              <Badge color="blue" size="xs" variant="light">
                re-check under way
              </Badge>
            )}
          </Group>
          <WaiverBadges waivers={c.waivers} />
          {c.standing === 'cleared-with-conditions' && c.conditions && (
            <Text fz="xs" c="yellow.8" lineClamp={3} title={c.conditions}>
              Conditions: {c.conditions}
            </Text>
          )}
        </Stack>
      ))}
      <RuledOutList ruledOut={item.ruledOut} linkHouseParts={linkHouseParts} />
    </Stack>
  );
}

/** The house parts a decision ruled the part out for (rejected, or a clearance revoked), with the reason. */
function RuledOutList({ ruledOut, linkHouseParts }: { ruledOut: readonly RuledOut[]; linkHouseParts: boolean }) {
  if (ruledOut.length === 0) return null;
  return (
    <Stack gap={2} aria-label="Ruled out">
      {ruledOut.map((r) => (
        <Stack key={r.housePart.id} gap={0}>
          <Group gap={4} wrap="wrap">
            <Badge color="red" size="sm" variant="light">
              {QUALIFICATION_STATE_LABELS[r.state]}
            </Badge>
            <Text span fz="xs" c="dimmed">
              for
            </Text>
            <HousePartName clearance={r} linkHouseParts={linkHouseParts} />
            <Text span fz="xs" c="dimmed">
              {formatDate(r.at)}
              {r.by ? ` by ${r.by.name}` : ''}
            </Text>
          </Group>
          {r.reason && (
            <Text fz="xs" c="red.9" lineClamp={3} title={r.reason}>
              {r.state === 'revoked' ? 'Revoked' : 'Rejected'}: {r.reason}
            </Text>
          )}
        </Stack>
      ))}
    </Stack>
  );
}
