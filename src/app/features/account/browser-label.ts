const BROWSERS: [RegExp, string][] = [
  [/Edg\/(\d+)/, 'Edge'],
  [/Firefox\/(\d+)/, 'Firefox'],
  [/HeadlessChrome\/(\d+)/, 'Headless Chrome'],
  [/Chrome\/(\d+)/, 'Chrome'],
  [/Version\/(\d+)[^ ]* Safari/, 'Safari'],
];
const SYSTEMS: [RegExp, string][] = [
  [/Windows/, 'Windows'],
  [/Android/, 'Android'],
  [/iPhone|iPad/, 'iOS'],
  [/Mac OS X/, 'macOS'],
  [/Linux/, 'Linux'],
];

/** "Firefox 133 on Windows" from a user-agent string; the raw string when nothing is recognised. */
export function browserLabel(userAgent: string | null): string {
  if (!userAgent) return 'Unknown browser';
  const browser = BROWSERS.map(([re, name]) => [userAgent.match(re), name] as const).find(([m]) => m);
  if (!browser) return userAgent;
  const system = SYSTEMS.find(([re]) => re.test(userAgent))?.[1];
  return `${browser[1]} ${browser[0]![1]}${system ? ` on ${system}` : ''}`;
}
