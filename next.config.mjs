/**
 * Pages get their Content-Security-Policy, with a per-request nonce, from proxy.ts
 * (lib/http/content-security-policy.ts). Route handlers answer data, never a document to run: nothing
 * at all may load in their name.
 */
const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

import { execFileSync } from 'node:child_process';

/** The git commit the app is built from, recorded in saved comparisons; empty when git is not there. */
function commitAtBuild() {
  try {
    return execFileSync('git', ['rev-parse', 'HEAD'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).trim();
  } catch {
    return '';
  }
}

/** @type {import('next').NextConfig} */
const securityHeaders = [
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
];

const nextConfig = {
  serverExternalPackages: ['sequelize', 'mariadb'],
  poweredByHeader: false,
  env: { EVENLOAD_BUILD_COMMIT: process.env.EVENLOAD_BUILD_COMMIT ?? commitAtBuild() },
  reactStrictMode: true,
  turbopack: {
    // @stdlib's statistics probe for generators with `new Function`; in the browser that probe is a
    // CSP violation (no 'unsafe-eval'), so the browser bundle gets an answer without eval.
    resolveAlias: { '@stdlib/assert-has-generator-support': { browser: './lib/platform/browser-has-generator-support.cjs' } },
  },
  experimental: {
    // Server actions carry form fields only (files go to /api/uploads); proxy.ts answers 413 above
    // this size (SERVER_ACTION_BODY_LIMIT_BYTES) before Next reads the body.
    serverActions: { bodySizeLimit: '1mb' },
  },
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: API_CONTENT_SECURITY_POLICY }] },
    ];
  },
};

export default nextConfig;
