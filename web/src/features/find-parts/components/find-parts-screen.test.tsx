import { screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { MODEL_BASES, type RegulatorRequest } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { DEMO_USERS, renderApp, signInAs } from '@/testing/render';
import { CONDITIONAL, FACETS, page, regulatorAnswer, searchItem } from '../testing/fixtures';

const APPROVED = searchItem(5, 'BRZ05-5V1');

function api(role: 'designer' | 'engineer' = 'designer', regulator = regulatorAnswer(), total = 2) {
  return mockApi({
    'GET /api/auth/me': { body: DEMO_USERS[role] },
    'GET /api/search/facets': { body: FACETS },
    'GET /api/search': { body: page([APPROVED, CONDITIONAL], { total }) },
    'POST /api/engineering/regulator': { body: regulator },
    // the designer's own qualification requests, shown beside the results
    'GET /api/qualification-requests': { body: { items: [], total: 0, pageIndex: 0, pageSize: 200 } },
  });
}
const searches = (mock: ReturnType<typeof mockApi>) => mock.calls.filter((c) => c.path === '/api/search');
const lastSearch = (mock: ReturnType<typeof mockApi>) => {
  const calls = mock.fetch.mock.calls.map((c) => new URL(String(c[0]), 'http://x')).filter((u) => u.pathname === '/api/search');
  return calls[calls.length - 1].searchParams;
};

// Typing into many fields is slow in jsdom on two cores.
describe('Find parts screen', { timeout: 20_000 }, () => {
  it('lists usable parts with their figures and why each may be designed in', async () => {
    signInAs('designer');
    api();
    renderApp('/find');
    const table = await screen.findByRole('table', { name: 'Search results' });
    const row = await within(table).findByRole('row', { name: 'TPZ15-11' });
    expect(row).toHaveTextContent('Cleared with conditions');
    expect(row).toHaveTextContent('OHI-ZD-2110');
    expect(row).toHaveTextContent('since 05 Nov 2026');
    expect(row).toHaveTextContent(/Conditions: Incoming inspection/);
    expect(row).toHaveTextContent('re-check due');
    const approved = within(table).getByRole('row', { name: 'BRZ05-5V1' });
    expect(approved).toHaveTextContent('Approved source');
    expect(approved).toHaveTextContent('5.10 V');
    expect(approved).toHaveTextContent('±5.1 %');
    expect(approved).toHaveTextContent('28.0 Ω');
    expect(approved).toHaveTextContent('500 mW');
    expect(screen.getByTestId('result-count')).toHaveTextContent('2 usable parts');
    // designers cannot open the catalogue screens: names, not links
    expect(within(approved).queryByRole('link', { name: 'BRZ05-5V1' })).toBeNull();
  });

  it('links engineers to the vendor part and house part', async () => {
    signInAs('engineer');
    api('engineer');
    renderApp('/find');
    const row = await screen.findByRole('row', { name: 'BRZ05-5V1' });
    expect(within(row).getByRole('link', { name: 'BRZ05-5V1' })).toHaveAttribute('href', '/vendor-parts/5');
    expect(within(row).getByRole('link', { name: 'OHI-ZD-1051' })).toHaveAttribute('href', '/house-parts/7');
  });

  it('sends text and typed filters to the search in SI, and sorting and paging', async () => {
    signInAs('designer');
    const mock = api('designer', regulatorAnswer(), 60);
    const { user } = renderApp('/find');
    await screen.findByRole('row', { name: 'BRZ05-5V1' });
    await user.click(screen.getByRole('button', { name: 'next page' }));
    await waitFor(() => expect(lastSearch(mock).get('pageIndex')).toBe('1'));
    await user.type(screen.getByRole('textbox', { name: 'Search' }), 'brz05');
    await user.type(screen.getByRole('textbox', { name: 'VZ from' }), '4.5');
    await user.type(screen.getByRole('textbox', { name: 'VZ to' }), '5500 mV');
    await user.type(screen.getByRole('textbox', { name: /Power at least/ }), '400');
    await waitFor(() => {
      const q = lastSearch(mock);
      // a new filter starts again on the first page
      expect(q.get('pageIndex')).toBe('0');
      expect(q.get('q')).toBe('brz05');
      expect(q.get('vzFrom')).toBe('4.5');
      expect(q.get('vzTo')).toBe('5.5');
      expect(q.get('pdMin')).toBe('0.4');
    });
    await user.click(screen.getByRole('checkbox', { name: 'Whole tolerance window inside' }));
    await user.click(screen.getByRole('switch', { name: 'Include parts not cleared' }));
    await waitFor(() => expect(lastSearch(mock).get('includeNotCleared')).toBe('true'));
    expect(lastSearch(mock).get('vzWindow')).toBe('true');
    await user.click(screen.getByRole('button', { name: /PD max/ }));
    await waitFor(() => expect(lastSearch(mock).get('sort')).toBe('pdMax'));
    expect(searches(mock).length).toBeGreaterThan(1);
  });

  it('holds back a reversed Vz range and says so', async () => {
    signInAs('designer');
    const mock = api();
    const { user } = renderApp('/find');
    await screen.findByRole('row', { name: 'BRZ05-5V1' });
    await user.type(screen.getByRole('textbox', { name: 'VZ from' }), '6');
    await user.type(screen.getByRole('textbox', { name: 'VZ to' }), '5');
    expect(await screen.findByText('VZ from is above VZ to')).toBeInTheDocument();
    await new Promise((r) => setTimeout(r, 450));
    expect(lastSearch(mock).get('vzTo')).toBeNull();
  });

  it('checks a part in the circuit: the chosen resistor, the verdicts, the simple formula beside it, the caution', async () => {
    signInAs('designer');
    const mock = api();
    const { user } = renderApp('/find');
    await user.click(await screen.findByRole('button', { name: /Check BRZ05-5V1 .* in my circuit/ }));
    const form = screen.getByRole('form', { name: 'Circuit' });
    // nothing is sent while the supply is missing
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
    expect(await within(form).findByText('Enter the lowest supply voltage')).toBeInTheDocument();
    expect(within(form).getByText('Enter the largest load current')).toBeInTheDocument();
    expect(mock.callsTo('POST', '/api/engineering/regulator')).toHaveLength(0);

    await user.type(within(form).getByRole('textbox', { name: 'Nominal' }), '12 V');
    await user.click(within(form).getByRole('button', { name: 'Supply ±10 % around the nominal' }));
    expect(within(form).getByRole('textbox', { name: 'Lowest' })).toHaveValue('10.8 V');
    expect(within(form).getByRole('textbox', { name: 'Highest' })).toHaveValue('13.2 V');
    await user.type(within(form).getByRole('textbox', { name: 'Largest' }), '20');
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));

    await waitFor(() => expect(mock.callsTo('POST', '/api/engineering/regulator')).toHaveLength(1));
    const body = mock.callsTo('POST', '/api/engineering/regulator')[0].body as RegulatorRequest;
    expect(body).toMatchObject({
      supply: { min: 10.8, nom: 12, max: 13.2 },
      load: { min: 0, max: 0.02 },
      ambient: { min: -20, max: 70 },
      resistor: { series: 'E24', tolerance: 0.05 },
    });
    expect(body.card).toMatchObject({ vzNom: 5.1, vzMin: 4.85, vzMax: 5.36, izt: 0.005, zzt: 28, rthJA: 250 });

    const region = await screen.findByRole('region', { name: 'Circuit check of BRZ05-5V1' });
    expect(within(region).getByTestId('verdict-alert')).toHaveTextContent('BRZ05-5V1: Works at every corner');
    expect(within(region).getByTestId('chosen-resistor')).toHaveTextContent('240 Ω');
    expect(within(region).getByTestId('resistor-range')).toHaveTextContent('137 Ω … 244 Ω');
    expect(within(region).getByTestId('diode-power')).toHaveTextContent('162 mW of 320 mW');
    expect(within(region).getByTestId('output-band')).toHaveTextContent('4.610 V … 5.520 V');
    expect(within(region).getByTestId('line-regulation')).toHaveTextContent('110 mV/V');
    expect(within(region).getByTestId('load-regulation')).toHaveTextContent('490 mV');
    const simple = within(region).getByRole('group', { name: 'The simple formula' });
    expect(within(simple).getByTestId('simple-resistor')).toHaveTextContent('276 Ω');
    expect(within(simple).getByTestId('simple-finding')).toHaveTextContent(/above the largest working value 244 Ω/);
    expect(simple).toHaveTextContent(/the diode's tolerance of ±5.1 %/);
    expect(within(region).getByText(/lies outside the working range/)).toBeInTheDocument();
    expect(within(region).getByRole('list', { name: 'Assumptions' })).toHaveTextContent('self-heating');
    expect(within(region).getByText(/Estimates — confirm before you rely on them/)).toBeInTheDocument();
    await user.click(within(region).getByRole('button', { name: /Show all 2 corners/ }));
    expect(within(region).getByRole('table', { name: 'Corners' })).toHaveTextContent('13.2 V');
  });

  it('takes the last results away as soon as the circuit no longer matches them', { timeout: 90_000 }, async () => {
    signInAs('designer');
    const mock = api();
    const { user } = renderApp('/find');
    await user.click(await screen.findByRole('button', { name: /Check BRZ05-5V1 .* in my circuit/ }, { timeout: 15_000 }));
    const form = screen.getByRole('form', { name: 'Circuit' });
    await user.type(within(form).getByRole('textbox', { name: 'Lowest' }), '10.8');
    await user.type(within(form).getByRole('textbox', { name: 'Highest' }), '13.2');
    await user.type(within(form).getByRole('textbox', { name: 'Largest' }), '20 mA');
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
    expect(await screen.findByTestId('verdict-alert')).toHaveTextContent('Works at every corner');

    // An unreadable value: no verdict of the old circuit beside the error.
    const largest = within(form).getByRole('textbox', { name: 'Largest' });
    await user.clear(largest);
    await user.type(largest, '20 parsecs');
    await user.tab();
    expect(screen.queryByTestId('verdict-alert')).toBeNull();
    expect(screen.getByTestId('circuit-stale')).toHaveTextContent(/missing or do not read/);
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
    expect(screen.queryByText('Works at every corner')).toBeNull();

    // A readable but different circuit: marked, not shown, until checked again.
    await user.clear(largest);
    await user.type(largest, '25 mA');
    await user.tab();
    expect(screen.getByTestId('circuit-stale')).toHaveTextContent(/for other values/);
    expect(screen.queryByTestId('verdict-alert')).toBeNull();
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
    await waitFor(() => expect(mock.callsTo('POST', '/api/engineering/regulator')).toHaveLength(2));
    expect(await screen.findByTestId('verdict-alert')).toBeInTheDocument();
    expect(screen.queryByTestId('circuit-stale')).toBeNull();
  });

  it('says why when no resistor works', async () => {
    signInAs('designer');
    const reasons = [
      'no resistor works: the power limit needs at least 300 Ω but the knee needs at most 244 Ω; narrow the supply or load range, or use a diode with more power or a lower knee current',
    ];
    api('designer', regulatorAnswer({ verdict: 'no-solution', reasons, selected: null, range: { ...regulatorAnswer().range, min: 300 } }));
    const { user } = renderApp('/find');
    await user.click(await screen.findByRole('button', { name: /Check BRZ05-5V1 .* in my circuit/ }));
    const form = screen.getByRole('form', { name: 'Circuit' });
    await user.type(within(form).getByRole('textbox', { name: 'Lowest' }), '10.8');
    await user.type(within(form).getByRole('textbox', { name: 'Highest' }), '13.2');
    await user.type(within(form).getByRole('textbox', { name: 'Largest' }), '20 mA');
    await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
    const alert = await screen.findByTestId('verdict-alert');
    expect(alert).toHaveTextContent('No resistor works');
    expect(alert).toHaveTextContent(/power limit needs at least 300 Ω but the knee needs at most 244 Ω/);
    expect(screen.getByTestId('chosen-resistor')).toHaveTextContent('none');
    expect(screen.getByTestId('resistor-range')).toHaveTextContent('none: power needs ≥ 300 Ω, the knee ≤ 244 Ω');
    expect(screen.getByTestId('simple-finding')).toHaveTextContent(/No resistor keeps every corner working/);
  });

  it('compares two parts side by side in the same circuit', async () => {
    signInAs('designer');
    const mock = mockApi({
      'GET /api/auth/me': { body: DEMO_USERS.designer },
      'GET /api/search/facets': { body: FACETS },
      'GET /api/search': { body: page([APPROVED, CONDITIONAL]) },
      'POST /api/engineering/regulator': (call) =>
        (call.body as RegulatorRequest).card.vzNom === 5.1
          ? { body: regulatorAnswer() }
          : { status: 400, body: errorBody('card.zzt: out of range', [{ path: 'card.zzt', message: 'out of range' }]) },
    });
    const { user } = renderApp('/find');
    await user.click(await screen.findByRole('checkbox', { name: 'Compare BRZ05-5V1' }));
    await user.click(screen.getByRole('checkbox', { name: 'Compare TPZ15-11' }));
    const form = screen.getByRole('form', { name: 'Circuit' });
    await user.type(within(form).getByRole('textbox', { name: 'Lowest' }), '10.8');
    await user.type(within(form).getByRole('textbox', { name: 'Highest' }), '13.2');
    await user.type(within(form).getByRole('textbox', { name: 'Largest' }), '20');
    await user.click(within(form).getByRole('button', { name: 'Check 2 parts' }));
    await waitFor(() => expect(mock.callsTo('POST', '/api/engineering/regulator')).toHaveLength(2));
    const comparison = await screen.findByRole('table', { name: 'Comparison' });
    expect(
      within(comparison)
        .getAllByRole('columnheader')
        .map((h) => h.textContent),
    ).toEqual(['', expect.stringContaining('BRZ05-5V1'), expect.stringContaining('TPZ15-11')]);
    await waitFor(() => expect(comparison).toHaveTextContent('240 Ω E24 ±5 %'));
    // the second part's refusal is shown in its column, with the API's message
    expect(comparison).toHaveTextContent(/card\.zzt: out of range/);
    expect(screen.getByRole('tab', { name: 'TPZ15-11' })).toBeInTheDocument();
  });

  describe('what a designer takes away', { timeout: 60_000 }, () => {
    let saved: Blob[];
    // jsdom's Blob has no text(): read it as a page would.
    const savedText = () =>
      new Promise<string>((resolve) => {
        const reader = new FileReader();
        reader.onload = () => resolve(String(reader.result));
        reader.readAsText(saved[saved.length - 1]);
      });
    function recordDownloads() {
      saved = [];
      // jsdom has no object URLs and does not download: record what would be saved.
      URL.createObjectURL = vi.fn((blob: Blob) => {
        saved.push(blob);
        return 'blob:find';
      });
      URL.revokeObjectURL = vi.fn();
      vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    }
    afterEach(() => vi.restoreAllMocks());

    it('exports the results as CSV with headers in words and units, and the circuit check columns once it ran', async () => {
      recordDownloads();
      signInAs('designer');
      const noisy = searchItem(5, 'BRZ05-5V1', { card: { ...APPROVED.card!, tc: 0.0012 - 0.003 } });
      mockApi({
        'GET /api/auth/me': { body: DEMO_USERS.designer },
        'GET /api/search/facets': { body: FACETS },
        'GET /api/search': { body: page([noisy, CONDITIONAL]) },
        'POST /api/engineering/regulator': { body: regulatorAnswer() },
        'GET /api/qualification-requests': { body: { items: [], total: 0, pageIndex: 0, pageSize: 200 } },
      });
      const { user } = renderApp('/find');
      await screen.findByRole('row', { name: 'BRZ05-5V1' }, { timeout: 15_000 });
      await user.click(screen.getByRole('button', { name: 'Export CSV' }));
      await waitFor(() => expect(saved).toHaveLength(1));
      const before = (await savedText()).split('\r\n');
      expect(before[0]).toBe(
        'Part number,Manufacturer,Package,Zener voltage min (V),Zener voltage nominal (V),Zener voltage max (V),Test current (A),Tolerance (%),Dynamic impedance at test current (Ω),Power rating (W),Temperature coefficient (V/K),May be designed in for',
      );
      // rounded as printed: no -0.0018000000000000002 (IEEE 754 noise of 0.0012 − 0.003)
      expect(before[1]).toBe('BRZ05-5V1,Brackenford Semiconductor,SOD-123,4.85,5.1,5.36,0.005,5.1,28,0.5,-0.0018,OHI-ZD-1051: Approved source');
      expect(before[2]).toBe(
        'TPZ15-11,Tevorrow Power Devices,SMB,10.45,11,11.55,0.034,5,7,1.5,0.0003,OHI-ZD-2110: Cleared with conditions (Incoming inspection measures reverse leakage on five pieces per lot.)',
      );
      expect(before[0]).not.toContain('Circuit check');

      await user.click(screen.getByRole('button', { name: /Check BRZ05-5V1 .* in my circuit/ }));
      const form = screen.getByRole('form', { name: 'Circuit' });
      await user.type(within(form).getByRole('textbox', { name: 'Lowest' }), '10.8');
      await user.type(within(form).getByRole('textbox', { name: 'Highest' }), '13.2');
      await user.type(within(form).getByRole('textbox', { name: 'Largest' }), '20 mA');
      await user.click(within(form).getByRole('button', { name: 'Check circuit' }));
      await screen.findByTestId('verdict-alert');
      await user.click(screen.getByRole('button', { name: 'Export CSV' }));
      await waitFor(() => expect(saved).toHaveLength(2));
      const after = (await savedText()).split('\r\n');
      expect(after[0]).toMatch(
        /,Circuit check,Chosen resistor \(Ω\),Resistor series,Working range from \(Ω\),Working range to \(Ω\),Output lowest \(V\),Output highest \(V\),/,
      );
      expect(after[1]).toMatch(/,Works at every corner,240,E24,137,244,4.61,5.52,0.162,0.32,0.266$/);
      // a part the check did not run on has those cells empty
      expect(after[2]).toMatch(/,,,,,,,,,,$/);
    });

    it('downloads a part’s SPICE .model for a designer', async () => {
      recordDownloads();
      signInAs('designer');
      mockApi({
        'GET /api/auth/me': { body: DEMO_USERS.designer },
        'GET /api/search/facets': { body: FACETS },
        'GET /api/search': { body: page([APPROVED, CONDITIONAL]) },
        'GET /api/qualification-requests': { body: { items: [], total: 0, pageIndex: 0, pageSize: 200 } },
        'GET /api/vendor-parts/:id/model': (_c, p) => ({
          body: {
            vendorPartId: Number(p.id),
            cardVersion: 3,
            name: 'BRZ05_5V1',
            lines: { nom: '.model BRZ05_5V1 D(BV=5.1 IBV=5m NBV=1.5 RS=20)', min: '.model BRZ05_5V1_MIN D(BV=4.85 IBV=5m NBV=1.5 RS=20)', max: null },
            model: { bv: 5.1, ibv: 0.005, nbv: 1.5, rs: 20, nbvVt: 0.0388, alphaVz: 0.0003, basis: MODEL_BASES[0], assumptions: [] },
            warnings: [],
            caution: 'Estimates from datasheet values.',
          },
        }),
      });
      const { user } = renderApp('/find');
      await user.click(await screen.findByRole('button', { name: 'SPICE model of BRZ05-5V1' }));
      await waitFor(() => expect(saved).toHaveLength(1));
      const text = await savedText();
      expect(text).toContain('.model BRZ05_5V1 D(BV=5.1 IBV=5m NBV=1.5 RS=20)');
      expect(text).toContain('.model BRZ05_5V1_MIN');
      expect(text).toMatch(/^\* BRZ05-5V1: SPICE diode models fitted to rating card version 3/);
    });
  });
});
