// The parts of autocannon 9 the load test uses (the package ships no types). From its README.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  namespace autocannon {
    interface Request {
      method?: string;
      path?: string;
      body?: string;
      headers?: Record<string, string>;
      setupRequest?: (request: Request, context: Record<string, unknown>) => Request;
      onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
    }
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      requests?: Request[];
    }
    interface Result {
      requests: { total: number; average: number };
      errors: number;
      timeouts: number;
      non2xx: number;
    }
    interface Instance extends EventEmitter, PromiseLike<Result> {}
  }
  function autocannon(options: autocannon.Options): autocannon.Instance;
  export default autocannon;
}
