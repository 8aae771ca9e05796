import { Alert, Anchor, Badge, Button, Center, Grid, Group, Loader, Stack, Text } from '@mantine/core';
import { IconArrowLeft, IconChartLine } from '@tabler/icons-react';
import { Link, useNavigate } from 'react-router';
import { DecisionRecordButton } from '@/components/decision-record-button';
import { PageHeader } from '@/components/page-header';
import { QualificationStateBadge } from '@/components/qualification-state-badge';
import { VerdictBadge } from '@/components/verdict-badge';
import { ApiError, describeError } from '@/lib/api-client';
import { useSession } from '@/lib/session';
import { useQualification } from '../api/get-qualification';
import { AuditTrail } from './audit-trail';
import { CaseNotes } from './case-notes';
import { CommentsPanel } from './comments-panel';
import { EvaluationPanel } from './evaluation-panel';
import { RecheckFlag } from './recheck-flag';
import { SignOffPanel } from './sign-off-panel';
import { WaiversPanel } from './waivers-panel';

/** One qualification case: what was checked, what it came to, who signed it off, and everything that happened to it. */
export function QualificationCase({ id }: { id: number }) {
  const session = useSession();
  const navigate = useNavigate();
  const query = useQualification(id);

  if (query.isPending) {
    return (
      <Center py="xl">
        <Loader aria-label="Loading the case" />
      </Center>
    );
  }
  if (query.isError) {
    const missing = query.error instanceof ApiError && query.error.status === 404;
    return (
      <Alert color="red" role="alert" title={missing ? 'No such case' : 'The case could not be loaded'}>
        {describeError(query.error)}{' '}
        <Group gap="xs" mt="xs">
          <Button size="xs" variant="default" onClick={() => void query.refetch()}>
            Try again
          </Button>
          <Anchor component={Link} to="/qualifications" fz="sm">
            Back to the list
          </Anchor>
        </Group>
      </Alert>
    );
  }

  const q = query.data;
  const viewer = { id: session?.user.id ?? 0, role: session?.user.role ?? 'buyer' } as const;
  const reload = () => query.refetch();
  return (
    <>
      <PageHeader
        title={`Case #${q.id}: ${q.vendorPart.mpn} for ${q.housePart.partNumber}`}
        description={
          <Group gap={6} component="span" wrap="wrap">
            <QualificationStateBadge state={q.state} />
            <VerdictBadge verdict={q.overall} />
            {q.needsRecheck && (
              <Badge size="sm" color="orange" variant="outline">
                needs re-check
              </Badge>
            )}
            <span>
              <Anchor component={Link} to={`/vendor-parts/${q.vendorPart.id}`} fz="sm">
                {q.vendorPart.manufacturer} {q.vendorPart.mpn}
              </Anchor>
              {q.vendorPart.package ? `, ${q.vendorPart.package}` : ''}
              {q.sourceRole ? ` (${q.sourceRole} source)` : ' (no longer a source)'} of{' '}
              <Anchor component={Link} to={`/house-parts/${q.housePart.id}`} fz="sm">
                {q.housePart.partNumber}
              </Anchor>
            </span>
          </Group>
        }
        actions={
          <>
            <Button component={Link} to="/qualifications" variant="subtle" leftSection={<IconArrowLeft size={16} />}>
              Qualifications
            </Button>
            <Button component={Link} to={`/compare/${q.housePart.id}`} variant="default" leftSection={<IconChartLine size={16} />}>
              Compare sources
            </Button>
            <DecisionRecordButton caseId={q.id} state={q.state} />
          </>
        }
      />
      <Stack gap="md">
        <Group gap="xs" fz="sm" aria-label="Revisions">
          <Text fz="sm">Revision {q.revision}</Text>
          {q.previousId !== null && (
            <Anchor component={Link} to={`/qualifications/${q.previousId}`} fz="sm">
              ← previous: case #{q.previousId}
            </Anchor>
          )}
          {q.nextId !== null && (
            <Anchor component={Link} to={`/qualifications/${q.nextId}`} fz="sm">
              next: case #{q.nextId} →
            </Anchor>
          )}
          <Text fz="sm" c="dimmed">
            {q.housePart.description}
          </Text>
        </Group>
        <RecheckFlag q={q} />
        <Grid gutter="md">
          <Grid.Col span={{ base: 12, lg: 8 }}>
            <EvaluationPanel evaluation={q.evaluation} current={q.current} />
          </Grid.Col>
          <Grid.Col span={{ base: 12, lg: 4 }}>
            <Stack gap="md">
              <SignOffPanel q={q} viewer={viewer} onReload={reload} onDone={(result) => result.id !== q.id && navigate(`/qualifications/${result.id}`)} />
              <WaiversPanel q={q} viewer={viewer} />
              <CaseNotes key={q.version} q={q} canEdit={viewer.role === 'engineer' && q.state === 'draft'} onReload={reload} />
              <CommentsPanel q={q} canComment={viewer.role === 'engineer'} />
              <AuditTrail entries={q.audit} />
            </Stack>
          </Grid.Col>
        </Grid>
      </Stack>
    </>
  );
}
