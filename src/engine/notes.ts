// Reading the lines that are not rounds: colour and hook changes, stuffing, placements, fastening off.

import { US_HOOK_MM } from './abbreviations';
import type { NoteKind } from './types';

export interface NoteReading {
  kind: NoteKind;
  hookMm?: number;
  placement?: { label: string; betweenRounds: [number, number] | null; atRound: number | null; apart: number | null };
  smallParts?: boolean;
}

const RND = String.raw`(?:rounds?|rnds?|rds?|rows?|r)\.?\s*#?\s*`;
const FASTEN = /\b(fasten(?:ed|ing)?\s*off|f\/o|fo|finish(?:ed)?\s+off|cut\s+(?:the\s+)?yarn|break\s+(?:the\s+)?yarn)\b/i;
const HOOK = /\bhook\b/i;
const PLACE_VERB = /\b(place|insert|attach|sew|position|pin|embroider|stitch on|glue|add)\b/i;
const SMALL_PARTS = /\b(safety[\s-]+(?:eyes?|nose|noses)|plastic\s+(?:eyes?|nose)|beads?|buttons?|bells?|pellets?|animal\s+eyes?|doll\s+eyes?)\b/i;
const STUFF = /\b(stuff(?:ed|ing)?|fill(?:ing)?\s+(?:firmly|with))\b/i;
const COLOUR_NAMES =
  'white|black|red|pink|rose|blue|navy|green|mint|sage|yellow|mustard|orange|purple|lilac|lavender|brown|tan|grey|gray|beige|cream|ivory|oat|gold|silver|teal|coral|peach';
const COLOUR_WORDS = new RegExp(
  String.raw`\b(colou?rs?|mc|cc\d?|contrast(?:ing)?\s+colou?r|new\s+yarn)\b|\b(?:change|switch|swap)\s+(?:yarn\s+)?to\s+(?:${COLOUR_NAMES})\b|^\s*(?:with|using|in)\s+(?:${COLOUR_NAMES}|mc|cc)\b|\bjoin\s+(?:${COLOUR_NAMES}|new)\b|\b(?:${COLOUR_NAMES})\s+yarn\b|^\s*(?:with|using|in|change\s+to|switch\s+to)\s+(?:the\s+)?(?:[a-z]+\s+){0,2}yarn\b`,
  'i',
);
// A colour named by a capital letter ("Change to B", "With A, …"): case matters, or "in a st" would match.
const COLOUR_LETTER =
  /\b(?:[Cc]hange|[Ss]witch|[Ss]wap|[Jj]oin)\s+(?:yarn\s+|colou?r\s+)?(?:to\s+)?[A-Z]\b|^\s*(?:[Ww]ith|[Uu]sing|[Ii]n)\s+[A-Z](?=\s*(?:,|$|\s+(?:yarn|and|for)\b))/;

// "Join with sl st to first sc.", "Join.", "join rnd with ss in top of beg ch", "Sl st in first st to join".
// Not "Join the ears to the head" (a seam) or "Join new yarn" (a colour).
const SLIP = String.raw`(?:sl(?:ip)?\s*st(?:itch)?|ss)`;
const JOIN = new RegExp(
  String.raw`^\s*(?:join(?:\s+(?:the\s+)?(?:rounds?|rnds?|rds?|ring))?(?:\s*(?:[.,;!]|$)|\s+(?:with|using)\s+(?:a\s+)?${SLIP}\b|\s+(?:to|in|into)\s+(?:the\s+)?(?:first|1st|top|beg(?:inning)?|starting)\b)|${SLIP}\s+(?:to|in|into)\s+(?:the\s+)?(?:first|1st|top|beg(?:inning)?|starting)\b|${SLIP}(?:\s+\w+){0,6}\s+to\s+join\b)`,
  'i',
);

function num(s: string): number {
  return Number(s.replace(',', '.'));
}

/** Hook size in mm from "Switch to a 3 mm hook", "change to 2.5mm hook", "use a G-6 hook". */
export function hookMmOf(text: string): number | undefined {
  const mm = /(\d+(?:[.,]\d+)?)\s*mm\b/i.exec(text);
  if (mm) return num(mm[1]);
  const us = /\b([b-l])\s*[-/]?\s*(\d{1,2}(?:\.5|½)?)\s+hook\b|\b([b-l])[-/](\d{1,2}(?:\.5|½)?)\b/i.exec(text);
  if (us) {
    const letter = (us[1] ?? us[3]).toLowerCase();
    const size = us[2] ?? us[4];
    return US_HOOK_MM.get(`${letter}-${size}`);
  }
  return undefined;
}

function placementOf(text: string): NonNullable<NoteReading['placement']> {
  const between = new RegExp(String.raw`between\s+${RND}(\d+)\s*(?:and|&|-|–|—|to)\s*(?:${RND})?(\d+)`, 'i').exec(text);
  const at = new RegExp(String.raw`\b(?:at|on|in|onto|to|around|along|over)\s+(?:the\s+)?${RND}(\d+)\b`, 'i').exec(text);
  const apart =
    /(\d+)\s*(?:sts?|stitches)\s*(?:apart|from each other|in between)/i.exec(text) ??
    /with\s+(\d+)\s*(?:sts?|stitches)\s+between/i.exec(text);
  // What is placed: the words after the verb, up to where the position starts.
  let label = '';
  const verb = PLACE_VERB.exec(text);
  if (verb) {
    const rest = text.slice(verb.index + verb[0].length);
    const stop = /\b(between|at|on|onto|in|into|to|around|along|over|with|about|approximately|about)\b|[,.;:(]/i.exec(rest);
    label = (stop ? rest.slice(0, stop.index) : rest)
      .replace(/^\s*(?:the|a|an|your|both|two|2)\s+/i, '')
      .trim();
  }
  return {
    label,
    betweenRounds: between ? [Number(between[1]), Number(between[2])] : null,
    atRound: between ? null : at ? Number(at[1]) : null,
    apart: apart ? Number(apart[1]) : null,
  };
}

/** Classifies a note line. "Place marker" is not a placement of a part. */
export function classifyNote(text: string): NoteReading {
  const smallParts = SMALL_PARTS.test(text) || undefined;
  if (HOOK.test(text) && !/\bfrom\s+(?:the\s+)?hook\b/i.test(text)) {
    const hookMm = hookMmOf(text);
    return hookMm === undefined ? { kind: 'hook' } : { kind: 'hook', hookMm };
  }
  const placeVerb = PLACE_VERB.exec(text);
  const isMarker = /\b(?:place|move|insert)\s+(?:a\s+|the\s+)?(?:st(?:itch)?\s+)?marker\b|\bpm\b/i.test(text);
  const placesPart =
    !isMarker && placeVerb !== null && (smallParts || new RegExp(String.raw`between\s+${RND}\d|\b(?:at|on|to)\s+${RND}\d`, 'i').test(text) || /\bsew\b/i.test(text));
  if (FASTEN.test(text) && !(placesPart && placeVerb!.index < FASTEN.exec(text)!.index)) {
    return smallParts ? { kind: 'fasten-off', smallParts } : { kind: 'fasten-off' };
  }
  if (placesPart) {
    const r: NoteReading = { kind: 'placement', placement: placementOf(text) };
    if (smallParts) r.smallParts = true;
    return r;
  }
  if (COLOUR_WORDS.test(text) || COLOUR_LETTER.test(text)) return { kind: 'colour' };
  if (JOIN.test(text)) return { kind: 'join' };
  if (STUFF.test(text)) return { kind: 'stuffing' };
  return smallParts ? { kind: 'other', smallParts } : { kind: 'other' };
}
