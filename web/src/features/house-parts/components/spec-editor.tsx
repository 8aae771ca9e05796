import { useEffect, useState, type ReactNode } from 'react';
import { Alert, Badge, Button, Group, NumberInput, Paper, SimpleGrid, Stack, TagsInput, Text, TextInput, Title } from '@mantine/core';
import { useForm } from '@mantine/form';
import { getHotkeyHandler } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import { IconDeviceFloppy } from '@tabler/icons-react';
import { sameSpec, type SpecVersion } from '@shuntwise/contracts';
import { QuantityInput } from '@/components/quantity-input';
import { ApiError, describeError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-date';
import { useLeaveGuard } from '@/lib/leave-guard';
import { usePutSpec } from '../api/spec';
import { deratingReading, emptySpecForm, formPath, formToSpec, specToForm, specWarnings, validateSpecForm, type SpecFormValues } from '../utils/spec-form';

/** A plausibility warning under an input: shown, never blocking (the usual ranges live in contracts). */
function Warning({ text }: { text: string | undefined }) {
  if (!text) return null;
  return (
    <Text span fz="xs" c="orange.9" data-warning>
      ⚠ {text}
    </Text>
  );
}

function Section({ title, hint, children }: { title: string; hint?: string; children: ReactNode }) {
  return (
    <Stack gap={4}>
      <Group gap="xs" align="baseline">
        <Text fz="xs" fw={600} tt="uppercase" c="dimmed" style={{ letterSpacing: '0.06em' }}>
          {title}
        </Text>
        {hint && (
          <Text fz="xs" c="dimmed">
            {hint}
          </Text>
        )}
      </Group>
      {children}
    </Stack>
  );
}

export interface SpecEditorProps {
  housePartId: number;
  partNumber: string;
  /** The current version, null when the part has none yet. */
  current: SpecVersion | null;
  /** Values to start from instead of the current version (an earlier version picked from the list). */
  startFrom?: { version: number; values: SpecFormValues; nonce: number } | null;
}

/**
 * The house part's spec: the requirement at reference conditions and the application
 * envelope, every quantity typed with its unit. Saving makes a new version on top of
 * the one loaded; a stale base is refused by the API and nothing is lost here.
 */
export function SpecEditor({ housePartId, partNumber, current, startFrom }: SpecEditorProps) {
  // The version the form was loaded from: saves go on top of it, whatever the server has meanwhile.
  const [loaded, setLoaded] = useState<SpecVersion | null>(current);
  const baseVersion = loaded?.version ?? 0;
  const put = usePutSpec();
  const [stale, setStale] = useState<{ current: number; message: string } | null>(null);
  const [generalError, setGeneralError] = useState<unknown>(null);
  const form = useForm<SpecFormValues>({
    mode: 'controlled',
    initialValues: current ? specToForm(current.spec) : emptySpecForm(),
    validate: validateSpecForm,
  });

  // An earlier version chosen from the list replaces the form's values (not the base version).
  // A newer version from the server replaces an untouched form; with changes, the save's 409 decides.
  const untouched = !form.isDirty();
  useEffect(() => {
    if (current && current.version > (loaded?.version ?? 0) && untouched && !stale) {
      setLoaded(current);
      show(current);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [current, loaded, untouched, stale]);

  const startNonce = startFrom?.nonce;
  useEffect(() => {
    if (startFrom) form.setValues(startFrom.values);
    // Only a new pick (its nonce) replaces the values.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [startNonce]);

  /** Puts the form back to a saved version: values, what counts as unchanged, no dirty marks. */
  const show = (version: SpecVersion) => {
    const values = specToForm(version.spec);
    form.setInitialValues(values);
    form.setValues(values);
    form.resetDirty(values);
  };
  // Unsaved means the form states another requirement than the loaded version (a note alone is not saved).
  const changed = loaded ? form.isDirty() && !sameSpec(formToSpec(form.getValues()), loaded.spec) : true;
  useLeaveGuard(loaded ? changed : form.isDirty(), 'The spec has unsaved changes. Leave this page and lose them?');

  const save = (values: SpecFormValues, onTopOf = baseVersion) => {
    setGeneralError(null);
    if (loaded && onTopOf === loaded.version && sameSpec(formToSpec(values), loaded.spec)) {
      show(loaded);
      notifications.show({ color: 'gray', title: 'Nothing to save', message: `${partNumber}: the values equal version ${loaded.version}.` });
      return;
    }
    put.mutate(
      { housePartId, request: { baseVersion: onTopOf, spec: formToSpec(values), note: values.note.trim() || undefined } },
      {
        onSuccess: (saved) => {
          setStale(null);
          setLoaded(saved);
          show(saved);
          notifications.show({
            color: 'verdigris',
            title: saved.version === onTopOf ? 'Spec unchanged' : 'Spec saved',
            message: saved.version === onTopOf ? `${partNumber}: the values equal version ${saved.version}.` : `${partNumber}: version ${saved.version}.`,
          });
        },
        onError: (error) => {
          if (error instanceof ApiError && error.status === 409) {
            const match = /current version is (\d+)/.exec(error.fieldError('baseVersion') ?? '');
            setStale({ current: match ? Number(match[1]) : baseVersion, message: error.message });
            return;
          }
          if (error instanceof ApiError && error.errors?.length) {
            for (const e of error.errors) form.setFieldError(formPath(e.path), e.message);
          }
          setGeneralError(error);
        },
      },
    );
  };

  const submit = form.onSubmit(
    (values) => save(values),
    () => {
      notifications.show({ color: 'red', title: 'Spec not saved', message: 'Some fields need attention (marked in red); what you typed is kept.' });
    },
  );

  const ip = (path: string) => form.getInputProps(path);
  const warnings = specWarnings(form.getValues());
  // QuantityInput takes the SI value (null when empty) and hands one back; a value outside its usual range is warned about below it.
  const q = (path: string) => {
    const props = form.getInputProps(path);
    return {
      ...props,
      value: (props.value ?? null) as number | null,
      onChange: props.onChange as (value: number | null) => void,
      description: <Warning text={warnings[path]} />,
      inputWrapperOrder: ['label', 'input', 'description', 'error'] as Array<'label' | 'input' | 'description' | 'error'>,
    };
  };
  const derating = deratingReading(form.getValues().power.deratingPercent);
  return (
    <Paper component="form" onSubmit={submit} noValidate aria-label={`Spec of ${partNumber}`} onKeyDown={getHotkeyHandler([['mod+S', () => submit()]])}>
      <Stack gap="md">
        <Group justify="space-between">
          <Group gap="xs">
            <Title order={3} fz="h5">
              Spec
            </Title>
            <Badge variant="outline" color={loaded ? 'copper' : 'gray'}>
              {loaded ? `v${loaded.version}` : 'no spec yet'}
            </Badge>
            {loaded && (
              <Text fz="xs" c="dimmed">
                {loaded.createdBy?.name ?? '–'}, {formatDateTime(loaded.createdAt)}
                {loaded.note ? ` — ${loaded.note}` : ''}
              </Text>
            )}
            {changed && loaded && (
              <Badge color="yellow" size="sm">
                unsaved changes
              </Badge>
            )}
          </Group>
          <Button type="submit" size="xs" leftSection={<IconDeviceFloppy size={14} />} loading={put.isPending} title="Save (Ctrl+S)" disabled={!changed}>
            {changed ? `Save as v${baseVersion + 1}` : 'Saved'}
          </Button>
        </Group>

        {stale && (
          <Alert color="yellow" role="alert" title="Someone saved this spec meanwhile">
            <Stack gap="xs">
              <Text fz="sm">{stale.message} Your values are still in the form.</Text>
              <Group gap="xs">
                <Button size="xs" onClick={() => save(form.getValues(), stale.current)} loading={put.isPending}>
                  Save mine as v{stale.current + 1}
                </Button>
                <Button
                  size="xs"
                  variant="default"
                  onClick={() => {
                    if (!current) return;
                    setLoaded(current);
                    show(current);
                    setStale(null);
                  }}
                  disabled={!current || current.version !== stale.current}
                >
                  Drop mine, show v{stale.current}
                </Button>
              </Group>
            </Stack>
          </Alert>
        )}
        {generalError != null && (
          <Alert color="red" role="alert" title="Spec not saved">
            {describeError(generalError)}
          </Alert>
        )}

        <Section title="At the reference current" hint="Zener-voltage window and impedance at 25 °C">
          <SimpleGrid cols={{ base: 2, md: 5 }} spacing="xs">
            <QuantityInput label="Reference current" kind="current" unit="mA" withAsterisk {...q('iRef')} />
            <QuantityInput label="VZ min" kind="voltage" unit="V" withAsterisk {...q('vz.min')} />
            <QuantityInput label="VZ nom" kind="voltage" unit="V" withAsterisk {...q('vz.nom')} />
            <QuantityInput label="VZ max" kind="voltage" unit="V" withAsterisk {...q('vz.max')} />
            <QuantityInput label="Largest Zd at iRef" kind="resistance" unit="Ω" {...q('zdMax')} />
          </SimpleGrid>
        </Section>

        <SimpleGrid cols={{ base: 1, md: 2 }} spacing="md">
          <Section title="Knee" hint="Zd at the knee current ÷ Zd at the reference current, and/or the span over the envelope">
            <SimpleGrid cols={3} spacing="xs">
              <QuantityInput label="Knee current" kind="current" unit="mA" {...q('knee.iKnee')} />
              <NumberInput label="Largest ratio" min={1} max={10000} decimalScale={3} hideControls {...ip('knee.maxRatio')} />
              <QuantityInput label="Largest span" kind="voltage" unit="mV" {...q('knee.maxSpan')} />
            </SimpleGrid>
          </Section>
          <Section title="Leakage">
            <SimpleGrid cols={2} spacing="xs">
              <QuantityInput label="Largest IR" kind="current" unit="µA" {...q('leakage.irMax')} />
              <QuantityInput label="at VR" kind="voltage" unit="V" {...q('leakage.vr')} />
            </SimpleGrid>
          </Section>
          <Section title="Temperature coefficient" hint="window of αVZ">
            <SimpleGrid cols={2} spacing="xs">
              <QuantityInput label="αVZ from" kind="tempCoVoltage" unit="mV/K" {...q('tc.min')} />
              <QuantityInput label="αVZ to" kind="tempCoVoltage" unit="mV/K" {...q('tc.max')} />
            </SimpleGrid>
          </Section>
          <Section title="Power" hint="rating and the share of the derated power allowed">
            <SimpleGrid cols={2} spacing="xs">
              <QuantityInput label="Smallest PD rating" kind="power" unit="mW" {...q('power.pdMin')} />
              <NumberInput
                label="Use at most"
                suffix=" %"
                min={0}
                max={100}
                // No silent clamping: what is typed is what is stored, and the line below says what that is.
                clampBehavior="none"
                decimalScale={4}
                hideControls
                inputWrapperOrder={['label', 'input', 'description', 'error']}
                description={
                  derating && (
                    <Text span fz="xs" c="dimmed" data-testid="derating-reading">
                      {derating.stores}
                      {derating.fractionMeant !== null && (
                        <>
                          {' '}
                          <Text span fz="xs" c="orange.9">
                            — did you mean the fraction {String(form.getValues().power.deratingPercent)}, that is {derating.fractionMeant} %?
                          </Text>{' '}
                          <Button size="compact-xs" variant="light" onClick={() => form.setFieldValue('power.deratingPercent', derating.fractionMeant!)}>
                            Use {derating.fractionMeant} %
                          </Button>
                        </>
                      )}
                    </Text>
                  )
                }
                {...ip('power.deratingPercent')}
              />
            </SimpleGrid>
          </Section>
        </SimpleGrid>

        <Section title="Application envelope" hint="where the part operates">
          <SimpleGrid cols={{ base: 2, md: 4 }} spacing="xs">
            <QuantityInput label="Current from" kind="current" unit="mA" withAsterisk {...q('envelope.iMin')} />
            <QuantityInput label="Current to" kind="current" unit="mA" withAsterisk {...q('envelope.iMax')} />
            <QuantityInput label="Ambient from" kind="temperature" unit="°C" withAsterisk {...q('envelope.taMin')} />
            <QuantityInput label="Ambient to" kind="temperature" unit="°C" withAsterisk {...q('envelope.taMax')} />
          </SimpleGrid>
        </Section>

        <SimpleGrid cols={{ base: 1, md: 2 }} spacing="md">
          <Section title="Output window" hint="optional, over the whole envelope">
            <SimpleGrid cols={2} spacing="xs">
              <QuantityInput label="Output from" kind="voltage" unit="V" {...q('outputWindow.vMin')} />
              <QuantityInput label="Output to" kind="voltage" unit="V" {...q('outputWindow.vMax')} />
            </SimpleGrid>
          </Section>
          <Section title="Packages and judgement">
            <SimpleGrid cols={2} spacing="xs">
              <TagsInput label="Allowed packages" placeholder="any; Enter after each" {...ip('packages')} />
              <NumberInput label="Marginal within" suffix=" % of a limit" min={0} max={50} decimalScale={2} hideControls {...ip('marginalBandPercent')} />
            </SimpleGrid>
          </Section>
        </SimpleGrid>

        <Group align="flex-end" gap="xs">
          <TextInput
            style={{ flex: 1 }}
            label="Note for this version"
            placeholder="e.g. envelope widened for the outdoor variant"
            maxLength={500}
            {...ip('note')}
          />
          <Button type="submit" loading={put.isPending} disabled={!changed}>
            {changed ? `Save as v${baseVersion + 1}` : 'No changes to save'}
          </Button>
        </Group>
      </Stack>
    </Paper>
  );
}
