// Outside reference for the engineering tests: ngspice 45 (WebAssembly build in the npm
// package eecircuit-engine). One simulator per test file, started once and reused.

type Sim = { setNetList(text: string): void; runSim(): Promise<{ data: { name: string; values: unknown[] }[] }> };

/** Tight tolerances so ngspice's own convergence error stays far below the limits tested. */
export const NGSPICE_OPTIONS = '.options reltol=1e-7 vntol=1e-10 abstol=1e-16';

export interface Ngspice {
  /** Runs one netlist; vectors by lower-case name. */
  run(netlist: string): Promise<Map<string, number[]>>;
  /** How many netlists ran. */
  readonly runs: number;
}

export async function startNgspice(): Promise<Ngspice> {
  const { Simulation } = await import('eecircuit-engine');
  const s = new Simulation();
  await s.start();
  const sim = s as unknown as Sim;
  let runs = 0;
  return {
    get runs() {
      return runs;
    },
    /**
     * ngspice writes notes to stderr (console.error here), and jest would attach a stack to
     * each, naming the multi-megabyte WebAssembly data URL: collect them instead. A fatal
     * ngspice error never settles runSim, hence the time limit.
     */
    async run(netlist: string) {
      const messages: string[] = [];
      const { error, warn } = console;
      console.error = (...args: unknown[]) => void messages.push(args.join(' '));
      console.warn = console.error;
      let timer: NodeJS.Timeout | undefined;
      try {
        sim.setNetList(netlist);
        const result = await Promise.race([
          sim.runSim(),
          new Promise<never>((_, reject) => {
            timer = setTimeout(() => reject(new Error(`ngspice did not finish: ${messages.join(' | ')}\n${netlist}`)), 10000);
          }),
        ]);
        runs++;
        return new Map(result.data.map((d) => [d.name.toLowerCase(), d.values as number[]]));
      } finally {
        clearTimeout(timer);
        console.error = error;
        console.warn = warn;
      }
    },
  };
}
