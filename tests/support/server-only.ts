// server-only is a build-time marker; under vitest every module runs on the server.
export {};
