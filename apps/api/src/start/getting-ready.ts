import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';

/**
 * What answers on the app's port while the first process prepares (start/ready.ts runs this on a
 * thread of its own, so it answers while a migration holds the first process for minutes): a page
 * that says what is being done and looks again every few seconds, and for the API a 503 in the
 * app's error shape, both asking to come back shortly.
 */
const RETRY_SECONDS = 5;

let doing = 'Opening the database';
let server: Server | null = null;

const escaped = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

const page = () => `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${RETRY_SECONDS}">
<title>Busbar is getting ready</title>
<style>
  body { margin: 0; padding: 48px 16px; background: #f4f5f7; color: #1d2630; font: 16px/1.5 system-ui, sans-serif; }
  main { max-width: 480px; margin: 0 auto; padding: 24px; background: #fff; border-radius: 8px; box-shadow: 0 1px 3px rgba(0, 0, 0, 0.12); overflow-wrap: anywhere; }
  h1 { margin: 0 0 12px; font-size: 22px; }
  .doing { font-weight: 600; }
  .note { color: #56616d; font-size: 14px; }
</style>
</head>
<body>
<main>
<h1>Busbar is getting ready</h1>
<p class="doing" role="status">${escaped(doing)}</p>
<p class="note">Upgrading the database of a large network can take several minutes. This page looks again every ${RETRY_SECONDS} seconds and opens Busbar as soon as it is ready.</p>
</main>
</body>
</html>
`;

function answer(req: IncomingMessage, res: ServerResponse): void {
  const wantsPage = !req.url?.startsWith('/api/') && (req.headers.accept ?? '').includes('text/html');
  res.writeHead(503, {
    'Content-Type': wantsPage ? 'text/html; charset=utf-8' : 'application/json; charset=utf-8',
    'Retry-After': String(RETRY_SECONDS),
    'Cache-Control': 'no-store',
    Connection: 'close',
  });
  res.end(wantsPage ? page() : JSON.stringify({ error: { code: 'starting', message: `Busbar is getting ready (${doing.toLowerCase()}). Try again in a minute.` } }));
}

/** Answers on `port` (0: any free one); resolves with the port it answers on. */
export async function open(port: number): Promise<number> {
  const started = createServer(answer);
  await new Promise<void>((resolve, reject) => {
    started.once('error', reject);
    started.listen(port, () => resolve());
  });
  server = started;
  return (started.address() as { port: number }).port;
}

/** What the page says is being done now. */
export async function tell(words: string): Promise<void> {
  doing = words;
}

/** Stops answering and frees the port for the app's processes. */
export async function close(): Promise<void> {
  const closing = server;
  server = null;
  if (!closing) return;
  await new Promise<void>((resolve) => {
    closing.close(() => resolve());
    closing.closeAllConnections();
  });
}
