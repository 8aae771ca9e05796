import { Fragment } from 'react';
import { Anchor, Box, Group, Paper, Stack, Text } from '@mantine/core';
import type { CapturedMail } from '@shuntwise/contracts';
import { formatDateTime } from '@/lib/format-date';

const URL_PATTERN = /(https?:\/\/[^\s<>"')]+)/g;

/** The body as sent, with its links clickable (invitation links are opened from here in the demo). */
function MailBody({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <Box
      component="pre"
      fz="sm"
      m={0}
      p="sm"
      ff="monospace"
      style={{
        whiteSpace: 'pre-wrap',
        wordBreak: 'break-word',
        background: 'light-dark(var(--mantine-color-gray-0), var(--mantine-color-dark-8))',
        borderRadius: 'var(--mantine-radius-sm)',
      }}
    >
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <Anchor key={index} href={part} inherit underline="always">
            {part}
          </Anchor>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        ),
      )}
    </Box>
  );
}

export function MailList({ mails }: { mails: CapturedMail[] }) {
  if (mails.length === 0) {
    return (
      <Text fz="sm" c="dimmed">
        No mail captured yet. Invitations and notices appear here as soon as they are sent.
      </Text>
    );
  }
  return (
    <Stack gap="sm">
      {mails.map((mail) => (
        <Paper key={mail.id} component="article" aria-label={mail.subject} p="sm">
          <Group justify="space-between" align="baseline" wrap="wrap" gap="xs" mb={4}>
            <Text fw={600}>{mail.subject || '(no subject)'}</Text>
            <Text fz="xs" c="dimmed">
              {formatDateTime(mail.receivedAt)}
            </Text>
          </Group>
          <Text fz="sm">
            <Text span c="dimmed" fz="sm">
              To:{' '}
            </Text>
            {mail.to.join(', ')}
          </Text>
          <Text fz="sm" mb="xs">
            <Text span c="dimmed" fz="sm">
              From:{' '}
            </Text>
            {mail.from}
          </Text>
          <MailBody text={mail.text} />
        </Paper>
      ))}
    </Stack>
  );
}
