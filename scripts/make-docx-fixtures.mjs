/**
 * Writes the Word test documents in fixtures/docx/ (invented scenarios only). Run from the
 * project's root: node scripts/make-docx-fixtures.mjs. Needs Debian's pandoc for the first;
 * the output is committed, so the tests need neither pandoc nor this script.
 *
 * - desk-plants.docx: pandoc's conversion of desk-plants.md (a heading, paragraphs, a table with
 *   its caption, a footnote), as a Word file made by a common converter.
 * - features.docx: WordprocessingML written here by hand (ECMA-376 Part 1, §17), one paragraph
 *   per feature the Word reader must handle: a field's displayed result (its instructions not
 *   read), tracked insertions and deletions, a moved paragraph, a deleted paragraph mark,
 *   a superscript exponent, a Symbol-font χ, a tab and a no-break hyphen, a comment (not
 *   read), hidden text (not read), markup-compatibility fallbacks (read once), a table with a
 *   merged cell, and a footnote.
 */
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { strToU8, zipSync } from 'fflate';

const dir = new URL('../fixtures/docx/', import.meta.url);

execFileSync('pandoc', ['--from', 'markdown', '--to', 'docx', '--output', new URL('desk-plants.docx', dir).pathname, new URL('desk-plants.md', dir).pathname]);

const W = 'http://schemas.openxmlformats.org/wordprocessingml/2006/main';
const ns = `xmlns:w="${W}" xmlns:mc="http://schemas.openxmlformats.org/markup-compatibility/2006" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"`;
const run = (text, props = '') => `<w:r>${props ? `<w:rPr>${props}</w:rPr>` : ''}<w:t xml:space="preserve">${text}</w:t></w:r>`;
const para = (inner, pPr = '') => `<w:p>${pPr ? `<w:pPr>${pPr}</w:pPr>` : ''}${inner}</w:p>`;
const change = 'w:id="1" w:author="Reviewer A" w:date="2026-01-05T10:00:00Z"';

const body = [
  // 1: a heading by style
  para(run('Results'), '<w:pStyle w:val="Heading1"/>'),
  // 2: a field shows its result; its instructions are not read
  para(`${run('Bench height was read from a field, t(28) = ')}<w:r><w:fldChar w:fldCharType="begin"/></w:r><w:r><w:instrText xml:space="preserve"> MERGEFIELD t_value \\# "0.00" t(9) = 9.99 </w:instrText></w:r><w:r><w:fldChar w:fldCharType="separate"/></w:r>${run('2.10')}<w:r><w:fldChar w:fldCharType="end"/></w:r>${run(', p = .045.')}`),
  // 3: tracked changes read as accepted
  para(`${run('The revised value is t(40) = ')}<w:ins ${change}>${run('2.50')}</w:ins><w:del ${change.replace('1', '2')}><w:r><w:delText>9.99</w:delText></w:r></w:del>${run(', p = .017.')}`),
  // 4: a moved sentence: read where it went, not where it came from
  para(`<w:moveFrom ${change.replace('1', '3')}>${run('Moved away: t(8) = 5.00, p = .50.')}</w:moveFrom>${run('Soil stayed moist.')}`),
  // 5 and 6: a deleted paragraph mark joins the two paragraphs
  para(run('Watering took less time'), `<w:rPr><w:del ${change.replace('1', '4')}/></w:rPr>`),
  para(run('in the second week, t(22) = 2.40, p = .025.')),
  // 7: a superscript exponent
  para(`${run('Mould appeared at a rate of 3.2 × 10')}${run('−6', '<w:vertAlign w:val="superscript"/>')}${run(' per leaf and hour.')}`),
  // 8: a Symbol-font chi with a superscript 2
  para(`${run('Leaf colour differed by office, ')}<w:r><w:sym w:font="Symbol" w:char="F063"/></w:r>${run('2', '<w:vertAlign w:val="superscript"/>')}${run('(2, N = 120) = 4.20, p = .12.')}`),
  // 9: a tab and a no-break hyphen as the minus
  para(`${run('Shade')}<w:r><w:tab/></w:r>${run('lowered growth, t(18) = ')}<w:r><w:noBreakHyphen/></w:r>${run('2.30, p = .034.')}`),
  // 10: a comment on some words; the comment itself is not read
  para(`<w:commentRangeStart w:id="0"/>${run('Two pots cracked.')}<w:commentRangeEnd w:id="0"/><w:r><w:commentReference w:id="0"/></w:r>`),
  // 11: hidden text is not shown, so not read
  para(`${run('Visible words.')}${run(' Hidden: t(9) = 1.00, p = .001.', '<w:vanish/>')}`),
  // 12: markup compatibility: the choice is read, its fallback copy is not
  para(`<mc:AlternateContent><mc:Choice Requires="w14">${run('Chosen text, t(16) = 2.20, p = .043.')}</mc:Choice><mc:Fallback>${run('Chosen text, t(16) = 2.20, p = .043.')}</mc:Fallback></mc:AlternateContent>`),
  // 13: an empty paragraph still counts
  para(''),
  // 14: a table's caption
  para(run('Table 1. Growth by light.')),
  // 15–22: a table, one paragraph per cell; the first column's second cell is merged down
  `<w:tbl><w:tblGrid><w:gridCol/><w:gridCol/><w:gridCol/><w:gridCol/></w:tblGrid>${[
    ['Measure', 't', 'df', 'p'],
    ['Height', '2.10', '28', '.045'],
  ].map((row) => `<w:tr>${row.map((c) => `<w:tc>${para(run(c))}</w:tc>`).join('')}</w:tr>`).join('')}</w:tbl>`,
  // 23: a footnote reference
  para(`${run('Leaf count rose, t(30) = 1.20, p = .24.')}<w:r><w:rPr><w:vertAlign w:val="superscript"/></w:rPr><w:footnoteReference w:id="1"/></w:r>`),
  '<w:sectPr/>',
].join('');

const documentXml = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:document ${ns} mc:Ignorable="w14"><w:body>${body}</w:body></w:document>`;
const footnotesXml = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:footnotes ${ns}><w:footnote w:type="separator" w:id="-1"><w:p><w:r><w:separator/></w:r></w:p></w:footnote><w:footnote w:type="continuationSeparator" w:id="0"><w:p><w:r><w:continuationSeparator/></w:r></w:p></w:footnote><w:footnote w:id="1">${para(`<w:r><w:footnoteRef/></w:r>${run(' A check of the pots gave t(12) = 3.50, p = .40.')}`)}</w:footnote></w:footnotes>`;
const commentsXml = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:comments ${ns}><w:comment w:id="0" w:author="Reviewer A" w:date="2026-01-05T10:00:00Z">${para(run('Is this t(5) = 9.00, p = .90 right?'))}</w:comment></w:comments>`;
const stylesXml = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<w:styles ${ns}><w:style w:type="paragraph" w:styleId="Heading1"><w:name w:val="heading 1"/></w:style></w:styles>`;
const REL = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships';
const contentTypes = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/word/document.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.document.main+xml"/><Override PartName="/word/styles.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.styles+xml"/><Override PartName="/word/footnotes.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.footnotes+xml"/><Override PartName="/word/comments.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.comments+xml"/></Types>`;
const rootRels = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="${REL}/officeDocument" Target="word/document.xml"/></Relationships>`;
const docRels = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="${REL}/styles" Target="styles.xml"/><Relationship Id="rId2" Type="${REL}/footnotes" Target="footnotes.xml"/><Relationship Id="rId3" Type="${REL}/comments" Target="comments.xml"/></Relationships>`;

// a fixed date, so the archive is the same bytes each time
const mtime = new Date('2026-01-05T00:00:00Z');
const zipped = zipSync(
  {
    '[Content_Types].xml': [strToU8(contentTypes), { mtime }],
    '_rels/.rels': [strToU8(rootRels), { mtime }],
    'word/document.xml': [strToU8(documentXml), { mtime }],
    'word/_rels/document.xml.rels': [strToU8(docRels), { mtime }],
    'word/styles.xml': [strToU8(stylesXml), { mtime }],
    'word/footnotes.xml': [strToU8(footnotesXml), { mtime }],
    'word/comments.xml': [strToU8(commentsXml), { mtime }],
  },
  { level: 6 },
);
writeFileSync(new URL('features.docx', dir), zipped);
console.log('wrote fixtures/docx/desk-plants.docx and fixtures/docx/features.docx');
