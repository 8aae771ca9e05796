import { Button, Group, Paper, Stack, Text, Textarea, Title } from '@mantine/core';
import { useForm } from '@mantine/form';
import { qualificationCommentRequestSchema, type Qualification } from '@shuntwise/contracts';
import { formatDateTime } from '@/lib/format-date';
import { schemaResolver } from '@/lib/form';
import { useCommentOnQualification } from '../api/comment-on-qualification';
import { ChangeRefused } from './conflict-notice';

/** The discussion on a case; engineers may add to it in any state (comments never change the decision). */
export function CommentsPanel({ q, canComment }: { q: Qualification; canComment: boolean }) {
  const mutation = useCommentOnQualification();
  const form = useForm<{ text: string }>({ initialValues: { text: '' }, validate: schemaResolver(qualificationCommentRequestSchema) });
  const submit = form.onSubmit((values) => mutation.mutate({ id: q.id, text: values.text }, { onSuccess: () => form.reset() }));

  return (
    <Paper component="section" aria-label="Comments">
      <Stack gap="xs">
        <Title order={3} fz="h5">
          Comments ({q.comments.length})
        </Title>
        {q.comments.length === 0 && (
          <Text fz="sm" c="dimmed">
            No comments yet.
          </Text>
        )}
        {q.comments.map((c) => (
          <Stack key={c.id} gap={0} component="article" aria-label={`Comment by ${c.by.name}`}>
            <Text fz="xs" c="dimmed">
              {c.by.name}, {formatDateTime(c.at)}
            </Text>
            <Text fz="sm" style={{ whiteSpace: 'pre-wrap' }}>
              {c.text}
            </Text>
          </Stack>
        ))}
        {canComment && (
          <form onSubmit={submit} aria-label="Add a comment" noValidate>
            <Stack gap={6}>
              <Textarea label="Add a comment" autosize minRows={2} maxRows={8} {...form.getInputProps('text')} />
              {mutation.isError && <ChangeRefused error={mutation.error} />}
              <Group justify="flex-end">
                <Button type="submit" size="xs" variant="default" loading={mutation.isPending}>
                  Add comment
                </Button>
              </Group>
            </Stack>
          </form>
        )}
      </Stack>
    </Paper>
  );
}
