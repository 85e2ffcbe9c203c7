// In tests, `import 'server-only'` resolves here: the real package throws outside a React server build.
export {};
