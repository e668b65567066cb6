import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The package's root folder (where package.json and rules/ live), from this module's place. */
export function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i += 1) {
    if (existsSync(join(dir, 'package.json')) && existsSync(join(dir, 'rules'))) return dir;
    dir = dirname(dir);
  }
  throw new Error('plumbline: cannot find its package folder (rules/ and package.json)');
}

/** A rule's page, rules/<id>.md. */
export function ruleDoc(id: string): string {
  return readFileSync(join(packageRoot(), 'rules', `${id}.md`), 'utf8');
}

export function toolVersion(): string {
  const pkg = JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string };
  return pkg.version;
}

interface PackageFacts {
  version: string;
  repository?: { url?: string } | string;
}

/**
 * The address of a rule's page for people who read the report elsewhere (SARIF `helpUri`): the
 * page in the package's repository at this version's tag, from package.json's `repository`.
 */
export function rulePageUrl(id: string): string | undefined {
  const pkg = JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as PackageFacts;
  const raw = typeof pkg.repository === 'string' ? pkg.repository : pkg.repository?.url;
  const web = raw?.replace(/^git\+/, '').replace(/\.git$/, '');
  if (web === undefined || !/^https:\/\//.test(web)) return undefined;
  return `${web}/blob/v${pkg.version}/rules/${encodeURIComponent(id)}.md`;
}
