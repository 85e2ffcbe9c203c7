import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { HttpSession } from './http-session';

const root = path.resolve(__dirname, '../..');

/**
 * Calls a server action of the built app over HTTP as the browser does: the action's id from the
 * build's server-reference manifest in the Next-Action header, the arguments encoded with React's
 * own reply encoder, POSTed to a page that uses the action, same origin. Returns the response.
 */
export async function callServerAction(session: HttpSession, baseUrl: string, page: string, file: string, name: string, args: unknown[]): Promise<Response> {
  const manifest = JSON.parse(readFileSync(path.join(root, '.next/server/server-reference-manifest.json'), 'utf8')) as {
    node: Record<string, { filename: string; exportedName: string }>;
  };
  const id = Object.entries(manifest.node).find(([, entry]) => entry.filename === file && entry.exportedName === name)?.[0];
  if (!id) throw new Error(`no server action ${file}#${name} in the build`);
  // React's reply encoder as Next ships it (the same one the browser uses to call an action).
  const { encodeReply } = createRequire(path.join(root, 'package.json'))('next/dist/compiled/react-server-dom-turbopack/client.node.js') as {
    encodeReply: (value: unknown) => Promise<string | FormData>;
  };
  const body = await encodeReply(args);
  return session.send('POST', page, body, { 'next-action': id, origin: baseUrl, accept: 'text/x-component' });
}
