import type { LevelSetting } from '../rule-api/types.js';

/** The configuration file's contents (see schema/config.schema.json). */
export interface Config {
  root?: boolean;
  alpha?: number;
  sidedness?: 'one' | 'two';
  integerItems?: number;
  /** Files larger than this are skipped, said (the CLI; default 50 MiB). */
  maxFileBytes?: number;
  /** Patterns (.gitignore syntax, relative to the configuration file's folder) not checked when walking folders. */
  ignore?: string[];
  /**
   * The file name endings read when walking a folder (`.md`, `tex`, …; case-insensitive), in
   * place of the default list; the nearest configuration's list applies in its folder and below.
   */
  extensions?: string[];
  guidelines?: 'all' | Array<'sampl' | 'jars-quant' | 'consort'>;
  checklist?: boolean;
  rules?: Record<string, LevelSetting>;
}

/** A configuration problem, with the file and place it was found at. */
export class ConfigError extends Error {
  constructor(
    message: string,
    readonly file: string,
    readonly line?: number,
    readonly column?: number,
  ) {
    super(message);
    this.name = 'ConfigError';
  }
}
