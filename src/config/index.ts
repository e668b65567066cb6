export { ConfigFinder, CONFIG_NAMES, mergeConfig, parseConfigText, readConfigFile } from './load.js';
export { configProblems, SCHEMA_RULE_IDS } from './validate.js';
export { ConfigError, type Config } from './types.js';
