import { useCallback, useMemo, useRef, useState, type ReactNode } from 'react';
import { Alert, CloseButton, Grid, Group, Loader, Paper, Stack, Tabs, Text, Title } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { IconInfoCircle } from '@tabler/icons-react';
import type { RegulatorResponse, SearchItem } from '@shuntwise/contracts';
import { useSearchParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { describeError, saveBlob } from '@/lib/api-client';
import { allSearchResults, EXPORT_LIMIT } from '../api/export-results';
import { useCircuitChecks } from '../api/check-circuit';
import { useSearchParts } from '../api/search-parts';
import { regulatorRequest, type CircuitRequest } from '../utils/circuit';
import { resultsCsv } from '../utils/results-csv';
import { DEFAULT_PAGE_SIZE, searchParamsFromUrl } from '../utils/search-state';
import { CircuitComparison } from './circuit-comparison';
import { CircuitForm } from './circuit-form';
import { CircuitResult } from './circuit-result';
import { MAX_COMPARED, ResultsTable } from './results-table';
import { SearchFilters, type FilterChanges } from './search-filters';

export interface FindPartsScreenProps {
  /** Engineers and admins may open the catalogue's pages from here. */
  linkCatalogue: boolean;
  /** What a result offers besides the check (the route puts "ask for qualification" here). */
  renderPartAction?: (item: SearchItem) => ReactNode;
  /** Shown above the filters (the route puts the caller's qualification requests here). */
  requestsPanel?: ReactNode;
}

/**
 * Find parts: the parts a designer may design in, found by filters and text, and for one
 * to three of them the series-regulator check against the designer's own circuit.
 */
export function FindPartsScreen({ linkCatalogue, renderPartAction, requestsPanel }: FindPartsScreenProps) {
  const [search, setSearch] = useSearchParams();
  const params = useMemo(() => searchParamsFromUrl(search), [search]);
  const results = useSearchParts(params);
  const [chosen, setChosen] = useState<SearchItem[]>([]);
  const [active, setActive] = useState<string | null>(null);
  const [circuit, setCircuit] = useState<CircuitRequest | null>(null);
  // What the form describes now; results of another circuit are not shown beside it.
  const [typed, setTyped] = useState<CircuitRequest | null | undefined>(undefined);
  const stale = circuit !== null && typed !== undefined && JSON.stringify(typed) !== JSON.stringify(circuit);
  const checkRef = useRef<HTMLDivElement>(null);

  // The address the last change produced. react-router's functional update starts from the
  // search params of the last render, so two changes before a re-render (a debounced filter
  // landing right after a click) would drop the first; changes start from this instead.
  const latest = useRef(search.toString());
  const produced = useRef(new Set<string>());
  const rendered = search.toString();
  if (rendered === latest.current) produced.current.clear();
  else if (!produced.current.has(rendered)) {
    // Changed from outside (a link, the navigation): that is the base now.
    latest.current = rendered;
    produced.current.clear();
  }
  const setParams = useCallback(
    (changes: FilterChanges, resetPage = true) => {
      const next = new URLSearchParams(latest.current);
      for (const [k, v] of Object.entries(changes)) {
        if (v === undefined || v === null || v === '' || v === false) next.delete(k);
        else next.set(k, String(v));
      }
      if (resetPage) next.delete('page');
      latest.current = next.toString();
      produced.current.add(latest.current);
      setSearch(next, { replace: true });
    },
    [setSearch],
  );

  const requests = useMemo(() => (circuit ? chosen.map((c) => regulatorRequest(circuit, c.card!)) : []), [circuit, chosen]);
  const checks = useCircuitChecks(requests);
  const compared = chosen.map((item, i) => ({ item, result: checks[i]?.data, error: checks[i]?.error ? describeError(checks[i].error) : null }));

  const [exporting, setExporting] = useState(false);
  const exportCsv = async () => {
    setExporting(true);
    try {
      const { items, total } = await allSearchResults(params);
      const done = new Map<number, RegulatorResponse>();
      if (circuit && !stale) compared.forEach((c) => c.result && done.set(c.item.vendorPart.id, c.result));
      saveBlob(new Blob([resultsCsv(items, done)], { type: 'text/csv;charset=utf-8' }), 'shuntwise-find-parts.csv');
      if (total > items.length)
        notifications.show({
          color: 'orange',
          title: 'Export shortened',
          message: `The first ${EXPORT_LIMIT} of ${total} parts were saved: narrow the filters for the rest.`,
        });
    } catch (e) {
      notifications.show({ color: 'red', title: 'The results could not be exported', message: describeError(e) });
    } finally {
      setExporting(false);
    }
  };

  const toggle = (item: SearchItem) => {
    setChosen((list) => {
      if (list.some((c) => c.vendorPart.id === item.vendorPart.id)) return list.filter((c) => c.vendorPart.id !== item.vendorPart.id);
      return list.length >= MAX_COMPARED ? list : [...list, item];
    });
  };
  const checkOne = (item: SearchItem) => {
    setChosen((list) => (list.some((c) => c.vendorPart.id === item.vendorPart.id) ? list : [item]));
    setActive(String(item.vendorPart.id));
    requestAnimationFrame(() => checkRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' }));
  };
  const activeId = active && chosen.some((c) => String(c.vendorPart.id) === active) ? active : chosen[0] ? String(chosen[0].vendorPart.id) : null;

  return (
    <>
      <PageHeader
        title="Find parts"
        description="Parts you may design in: approved sources and alternates a second engineer cleared. Choose one, or up to three to compare, and check them in your circuit."
      />
      {requestsPanel}
      <SearchFilters params={params} onChange={setParams} />
      <ResultsTable
        page={results.data}
        loading={results.isPending}
        fetching={results.isFetching}
        error={results.error}
        sort={params.sort}
        onSort={(sort) => setParams({ sort: sort === 'relevance' ? undefined : sort })}
        onPage={(pageIndex, pageSize) => setParams({ page: pageIndex || undefined, size: pageSize === DEFAULT_PAGE_SIZE ? undefined : pageSize }, false)}
        chosenIds={chosen.map((c) => c.vendorPart.id)}
        onToggleChosen={toggle}
        onCheck={checkOne}
        linkCatalogue={linkCatalogue}
        includeNotCleared={params.includeNotCleared ?? false}
        renderPartAction={renderPartAction}
        onExport={() => void exportCsv()}
        exporting={exporting}
      />

      <Paper ref={checkRef} p="md" aria-labelledby="circuit-check-title" style={{ scrollMarginTop: 64 }}>
        <Group justify="space-between" mb="sm" wrap="wrap">
          <Title order={3} fz="h4" id="circuit-check-title">
            Circuit check
          </Title>
          <Group gap="xs">
            {chosen.map((c) => (
              <Group key={c.vendorPart.id} gap={2} px={8} py={2} style={{ border: '1px solid var(--mantine-color-default-border)', borderRadius: 4 }}>
                <Text fz="sm" fw={500}>
                  {c.vendorPart.mpn}
                </Text>
                {!c.cleared && (
                  <Text fz="xs" c="orange.7">
                    not cleared
                  </Text>
                )}
                <CloseButton size="xs" aria-label={`Remove ${c.vendorPart.mpn} from the check`} onClick={() => toggle(c)} />
              </Group>
            ))}
          </Group>
        </Group>
        <Text fz="sm" c="dimmed" mb="md">
          Supply → series resistor → diode in parallel with the load. The engineering core finds the resistor range that keeps the diode above its knee at the
          lowest supply and largest load and within its derated power at the highest supply and smallest load, picks the nearest standard value inside it, and
          solves every corner.
        </Text>
        <Grid gutter="lg">
          <Grid.Col span={{ base: 12, md: 4 }}>
            <CircuitForm
              onSubmit={(c) => {
                setCircuit(c);
                setTyped(c);
              }}
              onValuesChange={setTyped}
              busy={checks.some((q) => q.isFetching)}
              partCount={chosen.length}
            />
          </Grid.Col>
          <Grid.Col span={{ base: 12, md: 8 }}>
            {chosen.length === 0 && (
              <Alert color="gray" icon={<IconInfoCircle size={16} />} title="No part chosen yet">
                Press Check on a result, or tick up to three to compare them in the same circuit.
              </Alert>
            )}
            {chosen.length > 0 && !circuit && (
              <Alert color="gray" icon={<IconInfoCircle size={16} />} title="Describe your circuit">
                Enter the supply range, the load current and the ambient, then press {chosen.length > 1 ? `Check ${chosen.length} parts` : 'Check circuit'}.
              </Alert>
            )}
            {chosen.some((c) => !c.cleared) && circuit && !stale && (
              <Alert color="orange" mb="sm" title="Not cleared for new designs">
                {chosen
                  .filter((c) => !c.cleared)
                  .map((c) => c.vendorPart.mpn)
                  .join(', ')}{' '}
                {chosen.filter((c) => !c.cleared).length > 1 ? 'are' : 'is'} not cleared: the check shows how it would behave, but a component engineer must
                qualify it before it is designed in.
              </Alert>
            )}
            {stale && chosen.length > 0 && (
              <Alert color="gray" icon={<IconInfoCircle size={16} />} title="The circuit changed" data-testid="circuit-stale">
                {typed === null
                  ? 'Some values are missing or do not read, so the last results no longer apply. Correct them and check again.'
                  : `The results of the last check were for other values. Press ${chosen.length > 1 ? `Check ${chosen.length} parts` : 'Check circuit'} to see this circuit.`}
              </Alert>
            )}
            {circuit && !stale && chosen.length > 0 && (
              <Stack gap="md">
                {chosen.length > 1 && <CircuitComparison parts={compared} />}
                <Tabs value={activeId} onChange={setActive} keepMounted={false}>
                  {chosen.length > 1 && (
                    <Tabs.List mb="sm">
                      {chosen.map((c) => (
                        <Tabs.Tab key={c.vendorPart.id} value={String(c.vendorPart.id)}>
                          {c.vendorPart.mpn}
                        </Tabs.Tab>
                      ))}
                    </Tabs.List>
                  )}
                  {compared.map(({ item, result, error }) => (
                    <Tabs.Panel key={item.vendorPart.id} value={String(item.vendorPart.id)}>
                      {error && (
                        <Alert color="red" role="alert" title="The engineering core refused the check">
                          {error}
                        </Alert>
                      )}
                      {!result && !error && <Loader size="sm" aria-label="Checking" />}
                      {result && <CircuitResult result={result} circuit={circuit} card={item.card!} mpn={item.vendorPart.mpn} />}
                    </Tabs.Panel>
                  ))}
                </Tabs>
              </Stack>
            )}
          </Grid.Col>
        </Grid>
      </Paper>
    </>
  );
}
