// Until a command sets up its own handling, Ctrl-C or a kill ends the process at once with the
// shell's exit code for it (130, 143) instead of dying by the signal; nothing has been written yet.
const EXIT_CODE: Readonly<Record<string, number>> = { SIGINT: 130, SIGTERM: 143 };

function exitNow(signal: NodeJS.Signals): void {
  process.exit(EXIT_CODE[signal] ?? 1);
}

export function holdSignals(): void {
  process.on('SIGINT', exitNow);
  process.on('SIGTERM', exitNow);
}

/** A command that handles the signals itself takes over from here. */
export function releaseSignals(): void {
  process.off('SIGINT', exitNow);
  process.off('SIGTERM', exitNow);
}
