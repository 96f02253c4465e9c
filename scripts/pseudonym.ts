/**
 * Offline pseudonyms for clinics preparing a CSV upload: the same code as the browser (shared/pseudonym.ts).
 *
 *   npx tsx scripts/pseudonym.ts --salt <hex> --passphrase-file <file> ID [ID...]
 *   npx tsx scripts/pseudonym.ts --salt <hex> --passphrase-file <file> < ids.txt
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { derivePseudonymKey, pseudonymFor, PSEUDONYM_ALGORITHM } from '../shared/pseudonym';

export const HELP = `Usage: npx tsx scripts/pseudonym.ts --salt <hex> --passphrase-file <file> [ID ...]

Prints a CSV with the header "id,pseudonym" and one line for each local patient identifier given as arguments, or one per line on stdin.
  --salt <hex>               the clinic's salt (Loadline: GET /api/clinics/current/pseudonym-salt), 32 hex characters
  --passphrase-file <file>   a file holding the clinic passphrase (one trailing line break is ignored)
  --pseudonyms-only          print only the pseudonyms, one per line, in input order

Derivation: ${PSEUDONYM_ALGORITHM}; identifiers are trimmed and upper-cased first.

CAUTION: the output puts each patient identifier next to its pseudonym. That list re-identifies patients:
it is for the clinic's own use only. Keep it inside the clinic, never upload it, never send it to the registry;
upload only the pseudonym column. The passphrase is read from a file so that it stays out of shell history.`;

export type CliArgs = { salt: string; passphraseFile: string; ids: string[]; pseudonymsOnly: boolean };

export function parseArgs(argv: string[]): CliArgs | 'help' {
  const out: CliArgs = { salt: '', passphraseFile: '', ids: [], pseudonymsOnly: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--help' || a === '-h') return 'help';
    else if (a === '--salt') out.salt = (argv[++i] ?? '').trim().toLowerCase();
    else if (a === '--passphrase-file') out.passphraseFile = argv[++i] ?? '';
    else if (a === '--pseudonyms-only') out.pseudonymsOnly = true;
    else if (a.startsWith('--')) throw new Error(`Unknown option ${a}; see --help`);
    else out.ids.push(a);
  }
  if (!out.salt) throw new Error('Give the clinic salt with --salt <hex>; see --help');
  if (!out.passphraseFile) throw new Error('Give the passphrase file with --passphrase-file <file>; see --help');
  return out;
}

/** One line per identifier; a CSV field is quoted when it needs to be. */
export async function pseudonymLines(args: CliArgs, passphrase: string): Promise<string[]> {
  const key = await derivePseudonymKey(passphrase, args.salt);
  const lines: string[] = args.pseudonymsOnly ? [] : ['id,pseudonym'];
  for (const id of args.ids) {
    const p = await pseudonymFor(key, id);
    const field = /[",\r\n]/.test(id) ? `"${id.replace(/"/g, '""')}"` : id;
    lines.push(args.pseudonymsOnly ? p : `${field},${p}`);
  }
  return lines;
}

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const c of process.stdin) chunks.push(c as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

async function main(argv: string[]): Promise<void> {
  const args = parseArgs(argv);
  if (args === 'help') {
    console.log(HELP);
    return;
  }
  const passphrase = readFileSync(args.passphraseFile, 'utf8').replace(/\r?\n$/, '');
  if (args.ids.length === 0) {
    args.ids = (await readStdin()).split(/\r?\n/).filter((l) => l.trim() !== '');
  }
  if (args.ids.length === 0) throw new Error('No identifiers given (as arguments or on stdin)');
  process.stdout.write(`${(await pseudonymLines(args, passphrase)).join('\n')}\n`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main(process.argv.slice(2)).catch((e: unknown) => {
    console.error(`pseudonym: ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
