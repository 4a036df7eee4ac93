import type { Express } from 'express';
import { presentationReplacer } from '../../shared/present';

/**
 * The one response step that rounds numbers for people to read (shared/present.ts; the rule is stated
 * once in the contract, openapi.yaml "Numbers in answers"). It is Express's `json replacer`, so every
 * JSON answer — calculations, plans, tunings, exports, verification, analysis, problems — passes
 * through it and no handler rounds on its own.
 *
 * What is stored keeps full precision (a tuning stored from a plan holds the plan's own delays), and
 * every answer rounds it the same way, so the plan and the stored tuning answer the same figures. The
 * core compares at full precision; where a comparison is reported (tuning compare), differences below
 * what an answer can show count as none.
 */
export function presentNumbersInAnswers(app: Express): void {
  app.set('json replacer', presentationReplacer);
}
