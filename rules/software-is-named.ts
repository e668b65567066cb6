import { checklistRule } from '../src/rule-api/index.js';

/** The statistics software is named with its version. */
export const softwareIsNamed = checklistRule({
  id: 'software-is-named',
  summary: 'The statistics software is named with its version.',
  item: 'The statistics software and its version are named',
  guidelines: { sampl: 'the part on reporting statistical methods' },
  missingMessage: 'Not said: {detail}.',
  check: 'Name the software and its version where the analysis is described, e.g. "R 4.4.1".',
  assess(document) {
    if (document.results.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no t-test reported' }];
    const software = document.extraction.mentions.filter((m) => m.kind === 'software');
    const withVersion = software.find((m) => m.version);
    if (withVersion) return [{ scope: 'document', status: 'found', span: withVersion.span, detail: withVersion.printed, block: withVersion.block }];
    const named = software[0];
    if (named) return [{ scope: 'document', status: 'missing', span: named.span, block: named.block, detail: `the version of ${named.printed.trim()}` }];
    return [{ scope: 'document', status: 'missing', detail: 'which statistics software (and version) was used' }];
  },
});
