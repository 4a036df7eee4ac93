import type { RequestHandler } from 'express';
import { badRequest, type FieldError } from './problem';

const NUL = String.fromCharCode(0);
const hasNul = (text: string): boolean => text.includes(NUL) || /%00/i.test(text);

/**
 * No Isochron URL ever needs a NUL character, and SQLite ends an SQL text at the first NUL: Sequelize's
 * SQLite dialect writes string literals into the statement, so an id or filter holding one became a
 * syntax error and a 500. Refused here, for every route, with the parameter named.
 */
export const refuseNulInUrl: RequestHandler = (req, _res, next) => {
  const url = req.originalUrl;
  if (!hasNul(url)) return next();
  const cut = url.indexOf('?');
  const path = cut < 0 ? url : url.slice(0, cut);
  const query = cut < 0 ? '' : url.slice(cut + 1);
  const errors: FieldError[] = [];
  if (hasNul(path)) errors.push({ pointer: '/path', message: 'must not contain a NUL character' });
  for (const [name, value] of new URLSearchParams(query)) {
    if (value.includes(NUL) || name.includes(NUL)) {
      errors.push({
        pointer: `/query/${name.split(NUL).join('')}`,
        message: 'must not contain a NUL character',
      });
    }
  }
  next(badRequest('The URL contains a NUL character.', errors));
};
