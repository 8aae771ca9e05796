import type { ReactNode } from 'react';
import { Paper, Stack, Text } from '@mantine/core';
import { Brand } from './brand';
import { ColorSchemeToggle } from './color-scheme-toggle';
import classes from './public-frame.module.css';

/** The frame of the pages used before signing in: one card on graph paper. */
export function PublicFrame({ subtitle, children }: { subtitle?: ReactNode; children: ReactNode }) {
  return (
    <main className={classes.root}>
      <div className={classes.corner}>
        <ColorSchemeToggle />
      </div>
      <Paper className={classes.card} shadow="sm" p="xl">
        <Stack gap="lg">
          <Stack gap={4}>
            <Brand size="xl" />
            {subtitle && (
              <Text c="dimmed" fz="sm">
                {subtitle}
              </Text>
            )}
          </Stack>
          {children}
        </Stack>
      </Paper>
    </main>
  );
}
