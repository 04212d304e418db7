// Server tests: quiet logs, never seed the demo unless a test asks for it.
process.env.NODE_ENV = 'test';
process.env.LOG_LEVEL = 'silent';
