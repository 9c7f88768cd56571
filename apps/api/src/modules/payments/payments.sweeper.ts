import type { PaymentsService } from './payments.service';

export interface PaymentSweeper {
  start(): void;
  stop(): Promise<void>;
  /** one sweep now (tests call it; the timer calls it every `everyMs`) */
  tick(): Promise<{ checked: number; recorded: number; failed: number }>;
}

/**
 * Every `everyMs`, asks Stripe about open payments older than `olderThanMs` and records those that were
 * paid: a payment whose webhook never arrived (the API was down longer than Stripe's retries) is still
 * recorded. Started by index.ts beside the mail worker; one sweep at a time.
 */
export function createPaymentSweeper(
  service: Pick<PaymentsService, 'sweep'>,
  { everyMs, olderThanMs }: { everyMs: number; olderThanMs: number },
  log: { warn: (o: object, msg: string) => void },
): PaymentSweeper {
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<{ checked: number; recorded: number; failed: number }> | undefined;

  function tick() {
    running ??= service
      .sweep(olderThanMs)
      .then((out) => {
        if (out.recorded) log.warn(out, 'payment sweep: recorded payments whose webhook had not come');
        if (out.failed) log.warn(out, 'payment sweep: some open payments could not be looked up; trying again later');
        return out;
      })
      .finally(() => {
        running = undefined;
      });
    return running;
  }

  return {
    /** sweeps at once (payments made while the API was down) and then every `everyMs` */
    start() {
      if (timer) return;
      const run = () => void tick().catch((err: unknown) => log.warn({ err: String(err) }, 'payment sweep failed'));
      timer = setInterval(run, everyMs);
      timer.unref();
      run();
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = undefined;
      await running?.catch(() => undefined);
    },
    tick,
  };
}
