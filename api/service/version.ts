import { readFileSync } from 'node:fs';
import path from 'node:path';
import { projectRoot } from '../config';

/** The version of this Isochron, from package.json, read once (exports and reports carry it). */
export const ISOCHRON_VERSION: string = (
  JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version: string }
).version;
