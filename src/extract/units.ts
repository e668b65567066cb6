/** Nouns for people: one kind of unit, whatever they are called (patients, women, nurses). */
const PEOPLE = 'participants|patients|subjects|people|individuals|children|adults|students|pupils|staff|volunteers|respondents|women|men|infants|pairs|twins|nurses|doctors|clinicians|teachers|workers|employees|mothers|fathers|families|households|cases|athletes|players|drivers|residents|users|customers|raters|observers'.split('|');
/** Nouns for other units: animals, plants, places, body parts; each its own kind. */
const OTHER_UNITS = 'animals|mice|rats|dogs|cows|sheep|pigs|fish|birds|plots|sites|trees|plants|seedlings|fields|farms|ponds|lakes|streams|transects|quadrats|stands|colonies|hives|schools|classes|classrooms|wards|clinics|hospitals|units|samples|specimens|eyes|teeth|knees|limbs|hands'.split('|');

/**
 * Nouns for the people or units a study counts (`24 participants`, `the same 30 plots`,
 * `n = 9 mice`), as one alternation for patterns: their number is a sample size, never a
 * measure's score.
 */
export const UNITS = `(?:${[...PEOPLE, ...OTHER_UNITS].join('|')})`;

/** The same nouns as a set, for a single word (plural as written). */
export const UNIT_WORDS: ReadonlySet<string> = new Set([...PEOPLE, ...OTHER_UNITS]);

/** The nouns for people, as a set. */
const PERSON_WORDS: ReadonlySet<string> = new Set(PEOPLE);

/**
 * The kind of unit a noun counts: people (all one kind), or the noun itself (plots, plants,
 * wards); undefined for nouns of no kind ("units", "samples").
 */
export function unitKind(noun: string): string | undefined {
  const w = noun.toLowerCase();
  if (!UNIT_WORDS.has(w) || w === 'units' || w === 'samples') return undefined;
  return PERSON_WORDS.has(w) ? 'people' : w;
}
