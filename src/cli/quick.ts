import { toolVersion } from '../engine/docs.js';
import { helpText } from './help.js';

/**
 * The answer to a command line that asks only for the version or the help (one word), or
 * undefined. Answered here, these load neither yargs nor the checker: the same text that
 * `run` gives for them (test/cli/bundle.test.ts compares the two).
 */
export function quickAnswer(argv: readonly string[], columns: number | undefined): string | undefined {
  if (argv.length !== 1) return undefined;
  const word = argv[0];
  if (word === '--version' || word === '-v') return `${toolVersion()}\n`;
  if (word === '--help' || word === '-h') return `${helpText(columns).trimEnd()}\n`;
  return undefined;
}
