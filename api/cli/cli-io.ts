import type { Services } from '../services';

/** Where the command line writes: stdout for results, stderr for notes and errors. */
export interface CliIo {
  out(line: string): void;
  err(line: string): void;
}

/** Opens the services on the configured database; the command line closes them when done. */
export type OpenServices = () => Promise<Services>;

/** Wrong arguments: the message and the usage are printed, and the process exits with 2. */
export class UsageError extends Error {}

/** The arguments were fine but the database says no (unknown owner...): the message, and exit code 1. */
export class RefusedError extends Error {}

export const USAGE = `Usage: npm run isochron -- <command> [options]

Commands:
  keys create --name NAME --role calculate|tuning|admin [--owner EMAIL] [--kind live|test]
              [--expires RFC3339] [--rate-limit PER_MINUTE] [--json]
      Creates an API key and prints it. The key is shown only this once: store it at once.
      Without --owner the key belongs to the oldest active admin.
  keys list [--owner EMAIL] [--include-revoked] [--json]
      Lists keys by prefix and last four characters (never the keys themselves).
  keys revoke KEY_ID
      Revokes a key. A running service refuses it within a second.
  users create --email EMAIL --role admin|developer|viewer [--name NAME] [--json]
      Creates a user and prints a one-time link (valid 7 days) for them to choose a password.

The database is DATABASE_URL (default sqlite:data/isochron.sqlite), as for the service.`;
