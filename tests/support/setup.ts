// Every vitest file runs in its own process: an in-memory PGlite unless DATABASE_URL names a server.
process.env.DB_MEMORY ??= "1";
process.env.BETTER_AUTH_URL ??= "http://localhost:3000";
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
