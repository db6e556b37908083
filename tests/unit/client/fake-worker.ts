// A stand-in for the field worker in unit tests: Comlink over a real MessageChannel.
import * as Comlink from 'comlink';
import { vi } from 'vitest';

/**
 * A stand-in for `new Worker(...)`: a real Comlink endpoint (a MessageChannel) exposing `api`, made
 * for each worker started; `api` may make the worker fail (the error event of a crash).
 */
export function stubWorker(makeApi: (fail: () => void) => object) {
  const started: string[] = [];
  class FakeWorker extends EventTarget {
    private port: MessagePort;
    constructor(url: URL) {
      super();
      started.push(url.pathname);
      const { port1, port2 } = new MessageChannel();
      Comlink.expose(
        makeApi(() => this.dispatchEvent(new Event('error'))),
        port1,
      );
      this.port = port2;
      this.port.start();
    }
    postMessage(message: unknown, transfer: Transferable[] = []) {
      this.port.postMessage(message, transfer);
    }
    override addEventListener(type: string, listener: EventListenerOrEventListenerObject, options?: AddEventListenerOptions | boolean) {
      if (type === 'message') this.port.addEventListener(type, listener as EventListener);
      else super.addEventListener(type, listener, options);
    }
    override removeEventListener(type: string, listener: EventListenerOrEventListenerObject) {
      if (type === 'message') this.port.removeEventListener(type, listener as EventListener);
      else super.removeEventListener(type, listener);
    }
    terminate() {
      this.port.close();
    }
  }
  vi.stubGlobal('Worker', FakeWorker);
  return started;
}
