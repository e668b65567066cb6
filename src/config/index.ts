export { ConfigFinder, CONFIG_NAMES, MAX_CONFIG_BYTES, mergeConfig, parseConfigText, readConfigFile, type FoundConfig } from './load.js';
export { configProblems, SCHEMA_RULE_IDS } from './validate.js';
export { ConfigError, type Config } from './types.js';
export { readRegularFile, type RegularFileProblem } from './regularFile.js';
