import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Alert, Button, Center, Stack, Text } from '@mantine/core';

interface State {
  error: Error | null;
}

/**
 * Shown when a page fails to render or its code cannot be fetched (e.g. after a new
 * deployment replaced the chunks). A new `resetKey` (the path) clears the error, so the
 * next page shows without remounting the layout around it.
 */
export class PageErrorBoundary extends Component<{ children: ReactNode; resetKey: string }, State> {
  override state: State = { error: null };

  static getDerivedStateFromError(error: Error): State {
    return { error };
  }

  override componentDidUpdate(previous: { resetKey: string }): void {
    if (this.state.error && previous.resetKey !== this.props.resetKey) this.setState({ error: null });
  }

  override componentDidCatch(error: Error, info: ErrorInfo): void {
    console.error('Page failed to render', error, info.componentStack);
  }

  override render() {
    const { error } = this.state;
    if (!error) return this.props.children;
    return (
      <Center mih="60vh" p="md">
        <Alert color="red" title="This page could not be shown" maw={520} role="alert">
          <Stack gap="xs">
            <Text fz="sm">{error.message}</Text>
            <Text fz="sm">Reloading fetches the current version of Shuntwise; nothing you saved is lost.</Text>
            <Button size="xs" variant="light" color="red" onClick={() => window.location.reload()} w="fit-content">
              Reload
            </Button>
          </Stack>
        </Alert>
      </Center>
    );
  }
}
