/// <reference lib="webworker" />
/**
 * Runs blocks of the shared Monte Carlo core off the main thread, one block per message, and
 * merges blocks into the result when asked. Each block draws from its own seeded stream, so the
 * result is the shared core's own whatever the number of workers: the same numbers as the server.
 */
import { createMonteCarloResponder } from './monte-carlo-responder';
import { samplesBuffers, type MonteCarloWorkerRequest } from './monte-carlo-protocol';

declare const self: DedicatedWorkerGlobalScope;

const respond = createMonteCarloResponder();

self.onmessage = (event: MessageEvent<MonteCarloWorkerRequest>) => {
  const message = respond(event.data);
  // A block's arrays are moved to the page, not copied.
  if (message) self.postMessage(message, message.type === 'block' ? samplesBuffers([message.samples]) : []);
};
