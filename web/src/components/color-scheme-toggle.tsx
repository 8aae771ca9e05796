import { ActionIcon, useComputedColorScheme, useMantineColorScheme } from '@mantine/core';
import { IconMoon, IconSun } from '@tabler/icons-react';

// A plain title rather than Mantine's Tooltip: the toggle is on the sign-in page, and
// Tooltip brings the floating-ui positioning code (about 12 kB gzip) with it.
export function ColorSchemeToggle() {
  const { setColorScheme } = useMantineColorScheme();
  const computed = useComputedColorScheme('light', { getInitialValueInEffect: false });
  const next = computed === 'dark' ? 'light' : 'dark';
  const label = next === 'dark' ? 'Use the dark scheme' : 'Use the light scheme';
  return (
    <ActionIcon variant="subtle" color="gray" size="lg" aria-label={label} title={label} onClick={() => setColorScheme(next)}>
      {next === 'dark' ? <IconMoon size={18} stroke={1.6} /> : <IconSun size={18} stroke={1.6} />}
    </ActionIcon>
  );
}
