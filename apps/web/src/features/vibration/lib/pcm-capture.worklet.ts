/**
 * AudioWorklet processor that hands the microphone's samples to the page: channel-averaged mono
 * PCM in blocks of BLOCK frames (about 40 ms at 48 kHz), transferred rather than copied.
 * Loaded with `audioWorklet.addModule` from its own file (the page's CSP allows scripts from its
 * origin only, so it cannot come from a blob).
 */

// The worklet scope's globals (not part of TypeScript's DOM library).
declare abstract class AudioWorkletProcessor {
  readonly port: MessagePort;
  abstract process(inputs: Float32Array[][], outputs: Float32Array[][], parameters: Record<string, Float32Array>): boolean;
}
declare function registerProcessor(name: string, processor: new () => AudioWorkletProcessor): void;

const BLOCK = 2048;

class PcmCaptureProcessor extends AudioWorkletProcessor {
  private block = new Float32Array(BLOCK);
  private filled = 0;
  private running = true;

  constructor() {
    super();
    this.port.onmessage = (event: MessageEvent<{ type: string }>) => {
      if (event.data.type === "stop") {
        this.flush();
        this.running = false;
        this.port.postMessage({ type: "stopped" });
      }
    };
  }

  private flush() {
    if (this.filled === 0) return;
    const out = this.block.slice(0, this.filled);
    this.port.postMessage({ type: "samples", samples: out }, [out.buffer]);
    this.block = new Float32Array(BLOCK);
    this.filled = 0;
  }

  process(inputs: Float32Array[][]): boolean {
    if (!this.running) return false;
    const channels = inputs[0];
    if (!channels || channels.length === 0) return true;
    const frames = channels[0]!.length;
    for (let i = 0; i < frames; i++) {
      let sum = 0;
      for (const c of channels) sum += c[i]!;
      this.block[this.filled++] = sum / channels.length;
      if (this.filled === BLOCK) this.flush();
    }
    return true;
  }
}

registerProcessor("ringdown-pcm-capture", PcmCaptureProcessor);
