// The api and e2e projects run whole workflows: every route fuzzed, server processes killed mid-sign-off,
// Chromium driven through a three-person sign-off, on a two-core machine that is often busy with other
// work. Their limit is a hang detector only (tests never assert speed); unit and client specs keep the
// global testTimeout in jest.config.js. A setup file is the per-project place: jest-circus reads
// testTimeout from the global config only.
jest.setTimeout(900_000);
