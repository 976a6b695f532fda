/**
 * Runs the melt engine on a simulation input file and prints the result as JSON.
 *   npm run --silent engine -- <input.json> [--model energy-balance|degree-day|enhanced-temperature-index] [--monthly]
 * --monthly prints the per band × month summary instead of the full result.
 * Invalid input: the problems go to stderr, one per line, and the exit code is 1.
 */
import { readFileSync } from 'node:fs';
import {
  simulate, simulateDegreeDay, simulateEnhancedTemperatureIndex, summariseByMonth, resultToJson,
  SimulationInputError, type MeltModel,
} from '../shared/melt/index';

const RUNNERS: Record<MeltModel, typeof simulate> = {
  'energy-balance': simulate,
  'degree-day': simulateDegreeDay,
  'enhanced-temperature-index': simulateEnhancedTemperatureIndex,
};

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(1);
}

const args = process.argv.slice(2);
const modelAt = args.indexOf('--model');
const model = (modelAt >= 0 ? args[modelAt + 1] : 'energy-balance') as MeltModel;
const file = args.find((a, i) => !a.startsWith('--') && !(modelAt >= 0 && i === modelAt + 1));
if (!file) fail('usage: npm run --silent engine -- <input.json> [--model energy-balance|degree-day|enhanced-temperature-index] [--monthly]');
if (!(model in RUNNERS)) fail(`unknown model "${model}"; use energy-balance, degree-day or enhanced-temperature-index`);

let input: unknown;
try {
  input = JSON.parse(readFileSync(file, 'utf8'));
} catch (error) {
  fail(`cannot read ${file}: ${(error as Error).message}`);
}
try {
  const result = RUNNERS[model](input);
  const output = args.includes('--monthly') ? summariseByMonth(result) : resultToJson(result);
  process.stdout.write(`${JSON.stringify(output)}\n`);
} catch (error) {
  if (error instanceof SimulationInputError) fail(error.issues.map((i) => `${i.path}: ${i.message}`).join('\n'));
  throw error;
}
