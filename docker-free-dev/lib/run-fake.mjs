// @ts-check
// The command-line side every fake shares: start it, say where it listens, close it cleanly
// on SIGTERM/SIGINT, and exit non-zero with the reason if it cannot start.
import { fileURLToPath } from 'node:url';

/** Where a fake keeps its state when LW_DATA_DIR is not set. */
export const defaultDataDir = () =>
  process.env['LW_DATA_DIR'] || fileURLToPath(new URL('../../.local/data', import.meta.url));

/**
 * @param {string} name how the fake names itself in its log lines
 * @param {() => Promise<{ url: string, close(): Promise<void> }>} startFake
 */
export async function runFake(name, startFake) {
  try {
    const fake = await startFake();
    console.log(`${name} listening on ${fake.url}`);
    let closing = false;
    const stop = async () => {
      if (closing) return;
      closing = true;
      try {
        await fake.close();
        process.exit(0);
      } catch (error) {
        console.error(`${name}: error while closing`, error);
        process.exit(1);
      }
    };
    process.on('SIGTERM', stop);
    process.on('SIGINT', stop);
  } catch (error) {
    console.error(`${name}: could not start:`, error);
    process.exit(1);
  }
}
