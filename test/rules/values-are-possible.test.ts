import { ruleTable } from './table.js';

ruleTable('values-are-possible', [
  { name: 'p above one', markdown: 'x, t(9) = 2.89, p = 043.', expect: ['1:17 p-above-one'] },
  { name: 'p = 1 is possible', markdown: 'x, t(29) = -8.22, p = 1.', expect: [] },
  { name: 'bound below zero', markdown: 'x, t(66) = 11.08, p < .00.', expect: ['1:19 p-below-zero-bound'] },
  { name: 'bound p < .000', markdown: 'x, t(66) = 11.08, p < .000.', expect: ['1:19 p-below-zero-bound'] },
  { name: 'df of zero', markdown: 'x, t(0) = 2.10, p = .045.', expect: ['1:6 df-not-positive'] },
  { name: "fractional df with Student's test", markdown: "Student's t(17.8) = 2.31, p = .033.", expect: ['1:13 student-df-fractional'] },
  { name: "whole df with Student's test", markdown: "Student's t(18) = 2.31, p = .033.", expect: [] },
  { name: "fractional df with Welch's test", markdown: "Welch's t(17.8) = 2.31, p = .033.", expect: [] },
]);
