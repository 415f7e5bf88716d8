import { loadConfig } from '../config';

/** An absolute link into the app for a mail body, from PUBLIC_URL (or the address the app listens on). */
export function appLink(path: string): string {
  const config = loadConfig();
  return `${(config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/$/, '')}${path}`;
}
