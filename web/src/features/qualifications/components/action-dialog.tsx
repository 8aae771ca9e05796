import { useEffect } from 'react';
import { Button, Group, Modal, Stack, Text, Textarea } from '@mantine/core';
import { useForm } from '@mantine/form';
import { notifications } from '@mantine/notifications';
import { QUALIFICATION_ACTION_REQUEST_SCHEMAS, QUALIFICATION_TRANSITIONS, type Qualification, type QualificationAction } from '@shuntwise/contracts';
import { schemaResolver } from '@/lib/form';
import { useQualificationAction } from '../api/act-on-qualification';
import { ChangeRefused } from './conflict-notice';

type TextField = 'note' | 'reason' | 'conditions';

interface ActionForm {
  field: TextField | null;
  label?: string;
  required?: boolean;
  placeholder?: string;
  /** What the action does, said before it is done. */
  explain: (q: Qualification) => string;
}

const source = (q: Qualification) => `${q.vendorPart.manufacturer} ${q.vendorPart.mpn} for ${q.housePart.partNumber}`;

export const ACTION_FORMS: Record<QualificationAction, ActionForm> = {
  evaluate: {
    field: null,
    explain: (q) =>
      `Evaluates ${source(q)} again on the spec and card the catalogue holds now (spec v${q.current.specVersion ?? '–'}, card v${q.current.cardVersion ?? '–'}).`,
  },
  submit: {
    field: 'note',
    label: 'Note for the reviewer',
    placeholder: 'optional',
    explain: (q) => `Sends ${source(q)} for review. Another engineer decides it; until then it can be sent back to draft or withdrawn.`,
  },
  'send-back': {
    field: 'reason',
    label: 'Why it goes back',
    required: true,
    placeholder: 'What the preparer should look at',
    explain: () => 'Returns the case to draft so it can be evaluated again or edited, then sent for review anew.',
  },
  approve: {
    field: 'note',
    label: 'Note',
    placeholder: 'required when the evaluation is not a pass: how the margin is covered',
    explain: (q) =>
      `Approves ${source(q)} as the house part's approved source (the reference part). The decision records you, now, spec v${q.specVersion} and card v${q.cardVersion}, and cannot be changed afterwards; a revocation ends it. The house part's buyers are told by mail.`,
  },
  clear: {
    field: 'note',
    label: 'Note',
    placeholder: 'optional',
    explain: (q) =>
      `Clears ${source(q)}. The decision records you, now, spec v${q.specVersion} and card v${q.cardVersion}, and cannot be changed afterwards. The house part's buyers are told by mail.`,
  },
  'clear-with-conditions': {
    field: 'conditions',
    label: 'Conditions',
    required: true,
    placeholder: 'What must hold for the source to be used, e.g. an incoming test per lot',
    explain: (q) =>
      `Clears ${source(q)} on the conditions you write here; buyers see them on the source list and in their mail. The decision records spec v${q.specVersion} and card v${q.cardVersion} and cannot be changed afterwards.`,
  },
  'clear-with-waiver': {
    field: 'note',
    label: 'Note',
    placeholder: 'optional',
    explain: (q) =>
      `Clears ${source(q)} on the approved waivers of its failing or marginal checks. The clearance lapses when a waiver expires; buyers see each waiver and its expiry. The decision records spec v${q.specVersion} and card v${q.cardVersion}.`,
  },
  reject: {
    field: 'reason',
    label: 'Reason for the rejection',
    required: true,
    explain: (q) => `Rejects ${source(q)}. The decision is fixed; a later re-check can open a new revision.`,
  },
  withdraw: {
    field: 'reason',
    label: 'Reason',
    placeholder: 'optional',
    explain: () => 'Abandons the case before any decision. It stays in the history; a new case can be opened for the source later.',
  },
  revoke: {
    field: 'reason',
    label: 'Reason for revoking the clearance',
    required: true,
    explain: (q) => `Ends the clearance of ${source(q)}: it may no longer be used as a source. The house part's buyers are told by mail.`,
  },
  recheck: {
    field: 'note',
    label: 'Note',
    placeholder: 'optional',
    explain: (q) => `Opens revision ${q.revision + 1}, evaluated on the spec and card as they are now. This case stays as it was decided.`,
  },
};

export const ACTION_COLOR: Partial<Record<QualificationAction, string>> = {
  approve: 'verdigris',
  clear: 'verdigris',
  'clear-with-conditions': 'lime',
  'clear-with-waiver': 'yellow',
  reject: 'red',
  revoke: 'grape',
  withdraw: 'gray',
};

const DONE: Record<QualificationAction, string> = {
  evaluate: 'evaluated again',
  submit: 'sent for review',
  'send-back': 'sent back to draft',
  approve: 'approved as the approved source',
  clear: 'cleared',
  'clear-with-conditions': 'cleared with conditions',
  'clear-with-waiver': 'cleared with waiver',
  reject: 'rejected',
  withdraw: 'withdrawn',
  revoke: 'revoked',
  recheck: 're-check opened',
};

/**
 * Confirms one action with the text it needs (conditions, a reason, an optional note),
 * validated by the action's own contracts schema, then sends it with the case version the
 * user saw, so a case that changed meanwhile is refused (409) instead of overwritten.
 */
export function ActionDialog({
  q,
  action,
  onClose,
  onReload,
  onDone,
  onClosed,
}: {
  q: Qualification;
  action: QualificationAction | null;
  onClose: () => void;
  onReload: () => Promise<unknown>;
  onDone?: (result: Qualification, action: QualificationAction) => void;
  /** After the dialog has gone (its closing transition ended). */
  onClosed?: () => void;
}) {
  const mutation = useQualificationAction();
  const spec = action ? ACTION_FORMS[action] : null;
  const field = spec?.field ?? null;
  const form = useForm<{ text: string }>({
    initialValues: { text: '' },
    validate: (values) => {
      if (!action || !field) return {};
      const errors = schemaResolver<Record<string, unknown>>(QUALIFICATION_ACTION_REQUEST_SCHEMAS[action])(body(values.text));
      return errors[field] ? { text: errors[field] } : {};
    },
  });
  const { reset } = form;
  const { reset: resetMutation } = mutation;

  // A new action starts empty.
  useEffect(() => {
    reset();
    resetMutation();
  }, [action, reset, resetMutation]);

  function body(text: string): Record<string, unknown> {
    const out: Record<string, unknown> = action === 'recheck' ? {} : { version: q.version };
    if (field) out[field] = spec?.required ? text : text.trim() || null;
    return out;
  }

  const submit = form.onSubmit((values) => {
    if (!action) return;
    mutation.mutate(
      { id: q.id, action, body: body(values.text) },
      {
        onSuccess: (result) => {
          notifications.show({
            color: 'verdigris',
            title: result.id === q.id ? `Case #${q.id} ${DONE[action]}` : `Re-check opened: case #${result.id}`,
            message: `${q.vendorPart.mpn} for ${q.housePart.partNumber}`,
          });
          onClose();
          onDone?.(result, action);
        },
      },
    );
  });

  const label = action ? QUALIFICATION_TRANSITIONS[action].label : '';
  return (
    <Modal opened={action !== null} onClose={onClose} onExitTransitionEnd={onClosed} title={`${label} — case #${q.id}`} size="lg" centered>
      {action && spec && (
        <form onSubmit={submit} aria-label={label} noValidate>
          <Stack gap="sm">
            <Text fz="sm">{spec.explain(q)}</Text>
            {field && (
              <Textarea
                label={spec.label}
                placeholder={spec.placeholder}
                withAsterisk={spec.required}
                autosize
                minRows={3}
                maxRows={10}
                data-autofocus
                {...form.getInputProps('text')}
              />
            )}
            {mutation.isError && (
              <ChangeRefused
                error={mutation.error}
                onReload={() =>
                  void onReload().then(() => {
                    mutation.reset();
                    onClose();
                  })
                }
              />
            )}
            <Group justify="flex-end" gap="xs">
              <Button variant="default" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" color={ACTION_COLOR[action]} loading={mutation.isPending}>
                {label}
              </Button>
            </Group>
          </Stack>
        </form>
      )}
    </Modal>
  );
}
