import { JobThread, ownExtension } from '../threads/job-thread.ts';
import type * as GettingReady from './getting-ready.ts';

/** While the first process prepares: what it is doing now, told to the page; and the end of it. */
export interface Preparing {
  tell(words: string): void;
  /** Frees the port for the app's processes. */
  done(): Promise<void>;
}

/**
 * Answers on the app's port while the first process prepares (getting-ready.ts), on a thread of
 * its own: a migration holds this one for minutes on a network's database, and a person opening
 * Busbar meanwhile should hear why it is not there yet rather than find nothing. If the port is
 * taken, says so and goes on (the app's processes will then fail to listen, as they would anyway).
 */
export async function answerWhilePreparing(port: number): Promise<Preparing & { port: number | null }> {
  const thread = new JobThread<typeof GettingReady>(new URL(`./getting-ready${ownExtension(import.meta.url)}`, import.meta.url), { maxOldGenerationSizeMb: 32, maxYoungGenerationSizeMb: 4 });
  const answering = await thread.run('open', port).catch((error: unknown) => {
    console.warn(`Nothing answers on port ${port} while Busbar gets ready: ${String(error)}`);
    return null;
  });
  let finished = false;
  return {
    port: answering,
    // Not waited for: the message reaches the thread while this one goes on to the work it names.
    tell: (words) => void thread.run('tell', words).catch(() => {}),
    done: async () => {
      if (finished) return;
      finished = true;
      if (answering !== null) await thread.run('close');
      await thread.stop();
    },
  };
}
