// Where the dashboard listens unless told otherwise. A module of its own so the command
// line can show these in `--help` without loading the server.
export const DEFAULT_PORT = 4173;
export const DEFAULT_HOST = '127.0.0.1';
