/**
 * The configuration schema compiled by Ajv. The browser page cannot compile at run time (its
 * Content-Security-Policy forbids eval), so its build (scripts/build-web.mjs) puts a validator
 * generated ahead of time with Ajv's standalone code in place of this module.
 */
import { Ajv2020 } from 'ajv/dist/2020.js';
import type { ValidateFunction } from 'ajv';
import schema from '../../schema/config.schema.json' with { type: 'json' };

const ajv = new Ajv2020({ allErrors: true, strict: true });
export const validateSchema: ValidateFunction = ajv.compile(schema);
