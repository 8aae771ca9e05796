import '@fontsource/lexend/latin-400.css';
import '@fontsource/lexend/latin-500.css';
import '@fontsource/lexend/latin-600.css';
import '@mantine/core/styles.css';
import '@/theme/focus.css';

import type { ReactNode } from 'react';
import { MantineProvider } from '@mantine/core';
import { cssVariablesResolver } from '@/theme/css-variables';
import { theme } from '@/theme/theme';

/**
 * The root provider: theme, colour scheme, fonts and base styles. Query state and
 * notifications are mounted further down (see QueryProvider and the signed-in layout),
 * so the sign-in page carries neither.
 */
export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <MantineProvider theme={theme} defaultColorScheme="auto" cssVariablesResolver={cssVariablesResolver}>
      {children}
    </MantineProvider>
  );
}
