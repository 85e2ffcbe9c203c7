/**
 * The words logger headers use, in the languages logger software commonly exports (English,
 * German, French, Spanish, Italian, Dutch). Ordinary dictionary words only (common practice:
 * a column is named after what it holds, "Zeit", "Kraft", "temps", "force", "tiempo", "fuerza",
 * "tempo", "forza", "tijd", "kracht"); no product's format is imitated. Accents are folded away
 * before matching, so "Étape" and "etape" are the same word.
 */

/** What a column holds. */
export type HeaderRole = 'time' | 'step' | 'pass' | 'tightened' | 'position' | 'load' | 'torque' | 'pressure' | 'ignore';

/** Lower case without accents: `"Étape 3"` → `"etape 3"`. */
export function foldHeader(header: string): string {
  return header.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();
}

/** Lower-case word tokens of a header, accents folded: `"Bolt 3 [kN]"` → `["bolt", "3", "kn"]`. */
export function headerTokens(header: string): string[] {
  return foldHeader(header)
    .split(/[^a-z0-9µμεε]+/u)
    .filter((t) => t !== '');
}

/** Words naming each role, by language (en, de, fr, es, it, nl), accents folded. */
const ROLE_WORDS: Record<Exclude<HeaderRole, 'ignore' | 'tightened'>, readonly string[]> = {
  time: ['t', 'time', 'elapsed', 'timestamp', 'seconds', 'sec', 'secs', 'zeit', 'sekunden', 'temps', 'secondes', 'tiempo', 'segundos', 'tempo', 'secondi', 'tijd', 'seconden'],
  pass: ['pass', 'round', 'durchgang', 'runde', 'passe', 'tour', 'pasada', 'vuelta', 'passata', 'giro', 'ronde', 'doorgang'],
  step: ['step', 'event', 'marker', 'seq', 'sequence', 'schritt', 'stufe', 'etape', 'pas', 'paso', 'passo', 'fase', 'stap'],
  position: ['position', 'pos', 'stud', 'bolt', 'bolzen', 'schraube', 'boulon', 'goujon', 'perno', 'esparrago', 'bullone', 'prigioniero', 'bout', 'tapeind', 'posicion', 'posizione', 'positie'],
  load: ['load', 'force', 'preload', 'tension', 'strain', 'microstrain', 'reading', 'value', 'kraft', 'last', 'vorspannkraft', 'charge', 'effort', 'fuerza', 'carga', 'forza', 'carico', 'kracht', 'belasting'],
  torque: ['torque', 'drehmoment', 'couple', 'par', 'coppia', 'koppel'],
  pressure: ['pressure', 'druck', 'pression', 'presion', 'pressione', 'druk'],
};

const WORD_ROLE = new Map<string, HeaderRole>();
for (const [role, words] of Object.entries(ROLE_WORDS)) for (const w of words) WORD_ROLE.set(w, role as HeaderRole);

/** Words naming a load unit's own line above the header ("units: lbf", "Einheit: kN", ...). */
export const UNIT_KEYS: readonly string[] = ['unit', 'units', 'load unit', 'force unit', 'einheit', 'einheiten', 'unite', 'unites', 'unidad', 'unidades', 'unita', 'eenheid', 'eenheden'];

/** The role a header names, from its first word (torque, pressure and tightened anywhere in it). */
export function roleOfHeader(header: string): HeaderRole {
  const t = headerTokens(header);
  const first = t[0] ?? '';
  const anywhere = (role: HeaderRole) => t.some((w) => WORD_ROLE.get(w) === role);
  if (anywhere('torque')) return 'torque';
  if (anywhere('pressure')) return 'pressure';
  if (t.includes('tightened') || (first === 'tool' && (t.includes('position') || t.includes('stud')))) return 'tightened';
  return WORD_ROLE.get(first) ?? 'ignore';
}

const POSITION_WORDS = [...ROLE_WORDS.position, ...ROLE_WORDS.load, 's', 'b', 'f'].join('|');
const STUD_HEADER = new RegExp(`^\\s*(?:${POSITION_WORDS})\\s*[-_#.]?\\s*(?:no\\.?\\s*|nr\\.?\\s*)?0*(\\d{1,3})(?![\\d.])`, 'i');

/**
 * The stud position a header names, or null: `Stud 1`, `S1`, `Bolt 3 [kN]`, `stud_03_kN`, `B4`,
 * `Load 2`, `F2 (lbf)`, `Position 5`, `Kraft 3`, `Bolzen 2`, `Boulon 4`, `Perno 1`.
 */
export function studPositionOfHeader(header: string): number | null {
  const m = STUD_HEADER.exec(foldHeader(header));
  if (!m || !m[1]) return null;
  const n = Number(m[1]);
  return n >= 1 ? n : null;
}

/** A logger channel a header names: its number as written and whether it is an analogue-input name (AI/AIN, zero-based). */
export interface ChannelName {
  number: number;
  analogueInput: boolean;
}

const CHANNEL_HEADER = /^\s*(?:(ch|chan|channel|kanal|canal|canale|kanaal|voie)|(ai|ain))\s*[-_#.]?\s*0*(\d{1,3})(?![\d.])/i;

/** The channel a header names: `CH1`, `Ch 2`, `Channel 3`, `Chan 4`, `ch1_kN`, `CH1 (kN)`, `Kanal 5`, `AI0`, `AIN7`; else null. */
export function channelOfHeader(header: string): ChannelName | null {
  const m = CHANNEL_HEADER.exec(foldHeader(header));
  if (!m || !m[3]) return null;
  return { number: Number(m[3]), analogueInput: m[2] !== undefined };
}

/**
 * Whether a header reads like a gauge or serial name (`SG-1041`, `G17`, `4471-A`): a short
 * word with a digit in it and no role word.
 */
export function looksLikeGaugeName(header: string): boolean {
  const h = header.trim();
  return h.length <= 24 && /\d/.test(h) && /^[A-Za-z0-9][A-Za-z0-9 _#.\-/]*(?:\s*[[(][^\])]*[\])])?$/.test(h) && roleOfHeader(h) === 'ignore';
}
