// Child-process entry of one phase, compiled by tsc first (child.ts):
// `node node_modules/.kvar-ledger-bench/tests/bench/worker.js <phase> <rows> <buses> <workDir>`.
// Each message is one line on stdout, prefixed so that anything else printed is ignored.
import { MESSAGE_PREFIX, PHASES, runPhase, type PhaseMessage, type PhaseName } from './phases.ts';
import { peakRssMb } from './timing.ts';

const [phase, rows, buses, workDir] = process.argv.slice(2);
if (!PHASES.includes(phase as PhaseName) || !rows || !buses || !workDir) {
  process.stderr.write(`usage: worker.ts <${PHASES.join('|')}> <rows> <buses> <workDir>\n`);
  process.exit(2);
}
const emit = (m: PhaseMessage) => process.stdout.write(MESSAGE_PREFIX + JSON.stringify(m) + '\n');
await runPhase(phase as PhaseName, { rows: Number(rows), buses: Number(buses) }, workDir, emit);
emit({ type: 'memory', peakRssMb: peakRssMb() });
