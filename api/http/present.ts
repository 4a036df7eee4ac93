import type { Express, Response } from 'express';
import { presentationReplacer } from '../../shared/present';

const JSON_TYPE = 'application/json; charset=utf-8';
const HAS_CHARSET = /;\s*charset=/i;

/**
 * Every JSON answer goes through here: `res.json` rounds numbers for people to read (shared/present.ts;
 * the rule is stated once in the contract, openapi.yaml "Numbers in answers"), so every answer —
 * calculations, plans, tunings, exports, verification, analysis, problems — is rounded the same way and
 * no handler rounds on its own.
 *
 * What is stored keeps full precision (a tuning stored from a plan holds the plan's own delays), and
 * every answer rounds it the same way, so the plan and the stored tuning answer the same figures. The
 * core compares at full precision; where a comparison is reported (tuning compare), differences below
 * what an answer can show count as none.
 *
 * It replaces Express's `res.json` on this app (`app.response`, Express's documented prototype of the
 * app's responses) with the same answer written directly: the same status, headers and body for a
 * JSON answer (`present.spec.ts` compares them), without Express's general `res.send` path — a MIME
 * lookup and two parses of the Content-Type for every answer, and 304 freshness checks an answer sent
 * with `Cache-Control: no-store` never uses. Node sets `Content-Length` itself.
 */
export function presentNumbersInAnswers(app: Express): void {
  // For anything that reads the setting rather than calling res.json (res.jsonp).
  app.set('json replacer', presentationReplacer);
  app.response.json = function json(this: Response, value: unknown): Response {
    const text = JSON.stringify(value, presentationReplacer) as string | undefined;
    const type = this.getHeader('Content-Type');
    if (type === undefined) this.setHeader('Content-Type', JSON_TYPE);
    else if (typeof type === 'string' && !HAS_CHARSET.test(type))
      this.setHeader('Content-Type', `${type}; charset=utf-8`);
    // As res.send: no body, and no headers describing one, for 204 and 304; an empty one for 205.
    const status = this.statusCode;
    if (status === 204 || status === 304) {
      this.removeHeader('Content-Type');
      this.removeHeader('Content-Length');
      this.removeHeader('Transfer-Encoding');
      this.end();
      return this;
    }
    if (status === 205) {
      this.setHeader('Content-Length', '0');
      this.removeHeader('Transfer-Encoding');
      this.end();
      return this;
    }
    if (text === undefined) {
      this.end(); // JSON.stringify(undefined): no body, as res.send(undefined)
    } else if (this.req.method === 'HEAD') {
      this.setHeader('Content-Length', Buffer.byteLength(text));
      this.end();
    } else {
      this.end(text, 'utf8');
    }
    return this;
  };
}
