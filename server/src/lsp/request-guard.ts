/**
 * The wrapper every request handler goes through: a request the client has cancelled is answered
 * as cancelled before any work (and again after any wait), and a fault in one feature is logged
 * and answered empty instead of failing the request or the server.
 */
import { LSPErrorCodes, ResponseError, type CancellationToken } from 'vscode-languageserver/node';

export type Guard = <P, R>(empty: Awaited<R>, handler: (params: P) => R) => (params: P, token?: CancellationToken) => R;

export function createGuard(log: (message: string) => void): Guard {
  return <P, R>(empty: Awaited<R>, handler: (params: P) => R) => {
    const report = (error: unknown) => {
      log(`rectilens: ${error instanceof Error ? error.stack : String(error)}`);
      return empty;
    };
    return (params: P, token?: CancellationToken): R => {
      if (token?.isCancellationRequested) return cancelled() as R;
      try {
        const answer = handler(params);
        if (!(answer instanceof Promise)) return answer;
        return answer.then((result) => (token?.isCancellationRequested ? cancelled() : result), report) as R;
      } catch (error) {
        return report(error) as R;
      }
    };
  };
}

function cancelled(): ResponseError<void> {
  return new ResponseError(LSPErrorCodes.RequestCancelled, 'the request was cancelled');
}
