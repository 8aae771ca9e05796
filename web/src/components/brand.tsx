import { Group, Text, useMantineTheme } from '@mantine/core';

/** The Shuntwise mark: a regulator diode's schematic symbol, drawn in the working colour. */
export function BrandMark({ size = 26 }: { size?: number }) {
  const theme = useMantineTheme();
  const stroke = `var(--mantine-color-${theme.primaryColor}-filled)`;
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="7" fill="none" stroke={stroke} strokeWidth="2" />
      <path d="M5 16 H11" stroke={stroke} strokeWidth="2" strokeLinecap="round" />
      <path d="M11 9 L20 16 L11 23 Z" fill={stroke} />
      <path d="M17 8.5 L20 9.5 L20 22.5 L23 23.5" fill="none" stroke={stroke} strokeWidth="2" strokeLinejoin="round" />
      <path d="M20 16 H27" stroke={stroke} strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

export function Brand({ size = 'lg' }: { size?: 'md' | 'lg' | 'xl' }) {
  const mark = size === 'xl' ? 34 : size === 'lg' ? 26 : 22;
  return (
    <Group gap={8} wrap="nowrap">
      <BrandMark size={mark} />
      <Text fw={600} fz={size} lts={0.3}>
        Shuntwise
      </Text>
    </Group>
  );
}
