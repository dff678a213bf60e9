// Stand-in for next's "server-only" marker when server modules run under vitest.
export {};
