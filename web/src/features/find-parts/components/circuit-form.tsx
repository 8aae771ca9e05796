import { useState } from 'react';
import { Anchor, Button, Collapse, Group, NumberInput, SegmentedControl, Select, SimpleGrid, Stack, Switch, Text, Title } from '@mantine/core';
import { useForm } from '@mantine/form';
import { IconChevronDown, IconChevronRight, IconPlugConnected } from '@tabler/icons-react';
import { formatPercent } from '@shuntwise/contracts';
import { QuantityInput } from '@/components/quantity-input';
import { EMPTY_CIRCUIT, RESISTOR_TOLERANCES, supplyAround, toCircuit, validateCircuit, type CircuitRequest, type CircuitValues } from '../utils/circuit';

export interface CircuitFormProps {
  initialValues?: CircuitValues;
  /** Called with the validated circuit when the designer asks for the check. */
  onSubmit: (circuit: CircuitRequest, values: CircuitValues) => void;
  busy?: boolean;
  /** Called on every edit with the circuit the form now describes (null while it does not read or is incomplete). */
  onValuesChange?: (circuit: CircuitRequest | null) => void;
  /** How many parts the check will run for (1 to 3). */
  partCount: number;
}

/**
 * The designer's circuit: supply → series resistor → diode ∥ load. Values read as typed
 * ("12 V", "20 mA", "-40"); a bare number is in the field's unit.
 */
export function CircuitForm({ initialValues = EMPTY_CIRCUIT, onSubmit, busy, partCount, onValuesChange }: CircuitFormProps) {
  const [advanced, setAdvanced] = useState(false);
  const form = useForm<CircuitValues>({
    mode: 'controlled',
    initialValues,
    validate: (values) => validateCircuit(values),
    onValuesChange: (values) => onValuesChange?.(Object.keys(validateCircuit(values)).length === 0 ? toCircuit(values) : null),
  });
  const v = form.values;
  type QuantityField = 'supplyMin' | 'supplyNom' | 'supplyMax' | 'loadMin' | 'loadMax' | 'ambientMin' | 'ambientMax';
  const quantity = (field: QuantityField) => ({
    value: v[field],
    onChange: (x: number | null) => form.setFieldValue(field, x),
    error: form.errors[field],
  });

  const applyTolerance = (fraction: number) => {
    if (v.supplyNom === null || Number.isNaN(v.supplyNom)) {
      form.setFieldError('supplyNom', 'Enter the nominal supply first');
      return;
    }
    const { min, max } = supplyAround(v.supplyNom, fraction);
    form.setValues({ supplyMin: min, supplyMax: max });
  };

  return (
    <form
      aria-label="Circuit"
      noValidate
      onSubmit={form.onSubmit((values) => {
        const circuit = toCircuit(values);
        if (circuit) onSubmit(circuit, values);
      })}
    >
      <Stack gap="sm">
        <Title order={4} fz="h6">
          Supply
        </Title>
        <SimpleGrid cols={3} spacing="xs">
          <QuantityInput label="Lowest" kind="voltage" unit="V" {...quantity('supplyMin')} fieldName="lowest supply" />
          <QuantityInput label="Nominal" kind="voltage" unit="V" {...quantity('supplyNom')} fieldName="nominal supply" placeholder="middle" />
          <QuantityInput label="Highest" kind="voltage" unit="V" {...quantity('supplyMax')} fieldName="highest supply" />
        </SimpleGrid>
        <Group gap={6}>
          <Text fz="xs" c="dimmed">
            From the nominal:
          </Text>
          {[0.05, 0.1, 0.2].map((f) => (
            <Button key={f} size="compact-xs" variant="default" onClick={() => applyTolerance(f)} aria-label={`Supply ±${formatPercent(f)} around the nominal`}>
              ±{f * 100} %
            </Button>
          ))}
        </Group>

        <Title order={4} fz="h6">
          Load current
        </Title>
        <SimpleGrid cols={2} spacing="xs">
          <QuantityInput label="Smallest" kind="current" unit="mA" {...quantity('loadMin')} fieldName="smallest load" />
          <QuantityInput label="Largest" kind="current" unit="mA" {...quantity('loadMax')} fieldName="largest load" />
        </SimpleGrid>

        <Title order={4} fz="h6">
          Ambient
        </Title>
        <SimpleGrid cols={2} spacing="xs">
          <QuantityInput label="Coldest" kind="temperature" unit="°C" {...quantity('ambientMin')} fieldName="coldest ambient" />
          <QuantityInput label="Hottest" kind="temperature" unit="°C" {...quantity('ambientMax')} fieldName="hottest ambient" />
        </SimpleGrid>

        <Title order={4} fz="h6">
          Series resistor
        </Title>
        <Group gap="xs" align="flex-end" grow>
          <Stack gap={4}>
            <Text fz="sm" fw={500} id="series-label">
              Series
            </Text>
            <SegmentedControl
              aria-labelledby="series-label"
              data={['E24', 'E96']}
              value={v.series}
              onChange={(s) =>
                form.setValues({ series: s as CircuitValues['series'], tolerance: s === 'E96' && Number(v.tolerance) > 0.01 ? '0.01' : v.tolerance })
              }
            />
          </Stack>
          <Select label="Tolerance" data={RESISTOR_TOLERANCES} allowDeselect={false} {...form.getInputProps('tolerance')} />
        </Group>

        <Anchor component="button" type="button" fz="xs" onClick={() => setAdvanced((a) => !a)} aria-expanded={advanced}>
          <Group gap={4}>
            {advanced ? <IconChevronDown size={14} /> : <IconChevronRight size={14} />}
            Margins and self-heating
          </Group>
        </Anchor>
        <Collapse in={advanced}>
          <Stack gap="xs">
            <SimpleGrid cols={2} spacing="xs">
              <NumberInput
                label="Knee margin"
                description="lowest diode current, × IZK"
                min={1}
                max={100}
                step={1}
                decimalScale={2}
                {...form.getInputProps('kneeFactor')}
                onChange={(x) => form.setFieldValue('kneeFactor', typeof x === 'number' ? x : Number(x) || 1)}
              />
              <NumberInput
                label="Power use"
                description="of the derated rating, %"
                min={1}
                max={100}
                step={5}
                suffix=" %"
                value={Math.round(v.powerFraction * 1000) / 10}
                onChange={(x) => form.setFieldValue('powerFraction', Math.min(1, Math.max(0.01, (typeof x === 'number' ? x : Number(x) || 100) / 100)))}
                error={form.errors.powerFraction}
              />
            </SimpleGrid>
            <Switch label="Include self-heating (needs RthJA on the card)" {...form.getInputProps('selfHeating', { type: 'checkbox' })} />
          </Stack>
        </Collapse>

        <Button type="submit" leftSection={<IconPlugConnected size={16} />} loading={busy} disabled={partCount === 0}>
          {partCount > 1 ? `Check ${partCount} parts` : 'Check circuit'}
        </Button>
      </Stack>
    </form>
  );
}
