// The uploadthing browser client PUTs files with XMLHttpRequest, which Node lacks. This carries
// exactly the members that client uses over Node's fetch, so the SDK's own client code can drive
// real HTTP uploads from a test. Progress events are not emitted: nothing under test reads them.
function parseOrNull(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null; // what a browser's XHR gives for responseType "json" when the body is not JSON
  }
}

class XhrOverFetch {
  status = 0;
  statusText = "";
  response: unknown = null;
  responseType = "";
  readonly upload = { addEventListener() {} };
  private method = "GET";
  private url = "";
  private readonly headers = new Headers();
  private readonly listeners = new Map<string, () => void>();
  private readonly abortController = new AbortController();

  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }

  setRequestHeader(name: string, value: string) {
    this.headers.set(name, value);
  }

  addEventListener(type: string, listener: () => void) {
    this.listeners.set(type, listener);
  }

  abort() {
    this.abortController.abort();
  }

  send(body: FormData) {
    fetch(this.url, { method: this.method, headers: this.headers, body, signal: this.abortController.signal })
      .then(async (reply) => {
        this.status = reply.status;
        this.statusText = reply.statusText;
        const text = await reply.text();
        this.response = this.responseType === "json" ? parseOrNull(text) : text;
        this.listeners.get("load")?.();
      })
      .catch(() => {
        if (!this.abortController.signal.aborted) this.listeners.get("error")?.();
      });
  }
}

export function installXhrOverFetch() {
  const global = globalThis as { XMLHttpRequest?: unknown };
  const previous = global.XMLHttpRequest;
  global.XMLHttpRequest = XhrOverFetch;
  return () => {
    global.XMLHttpRequest = previous;
  };
}
