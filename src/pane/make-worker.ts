/**
 * The bundled training worker. webpack 5 sees `new Worker(new URL(...,
 * import.meta.url))` and builds train-worker.ts as its own chunk, served
 * from the pane's own origin, so a strict `worker-src 'self'` allows it.
 */
export function makeTrainWorker(): Worker {
  return new Worker(new URL('./train-worker.ts', import.meta.url));
}
