import { useCallback, useEffect, useRef, useState } from "react";
import workletUrl from "./pcm-capture.worklet.ts?worker&url";
import { concatSamples, encodeWav16 } from "./wav-encoder";

/** Longest microphone recording [s]; the server takes up to 600 s, but a cut or a tap needs seconds. */
export const MAX_RECORDING_S = 60;

export type RecorderState = "idle" | "requesting" | "recording" | "stopping" | "recorded" | "error";

export interface RecordedAudio {
  wav: Blob;
  sampleRateHz: number;
  durationS: number;
  /** Peak absolute sample over the whole recording (0 … 1) */
  peak: number;
}

interface Session {
  stream: MediaStream;
  context: AudioContext;
  node: AudioWorkletNode;
  blocks: Float32Array[];
  frames: number;
  peak: number;
}

/** Why the microphone could not be opened, in words a person can act on. */
export function microphoneErrorMessage(error: unknown): string {
  const name = error instanceof DOMException ? error.name : "";
  switch (name) {
    case "NotAllowedError":
    case "SecurityError":
      return "The browser was not allowed to use the microphone. Allow it for this site (the icon by the address bar) and try again.";
    case "NotFoundError":
    case "OverconstrainedError":
      return "No microphone was found. Plug one in or use a phone, then try again.";
    case "NotReadableError":
    case "AbortError":
      return "The microphone is busy or could not start: close other apps using it and try again.";
    default:
      return `The microphone could not be opened${error instanceof Error && error.message ? ` (${error.message})` : ""}.`;
  }
}

/**
 * Records mono PCM from the microphone with the Web Audio API (an AudioWorklet taps the raw
 * samples; MediaRecorder would give compressed audio the analysis cannot use) and encodes it as a
 * 16-bit WAV when stopped. Exposes the live peak level and the elapsed time.
 * Echo cancellation, noise suppression and automatic gain are turned off: they would remove or
 * reshape exactly the tones the analysis looks for.
 */
export function useMicrophoneRecorder() {
  const [state, setState] = useState<RecorderState>("idle");
  const [error, setError] = useState<string | null>(null);
  const [level, setLevel] = useState(0);
  const [elapsedS, setElapsedS] = useState(0);
  const [recorded, setRecorded] = useState<RecordedAudio | null>(null);
  const session = useRef<Session | null>(null);
  const levelPeak = useRef(0);
  const frame = useRef<number | null>(null);

  const release = useCallback(() => {
    const s = session.current;
    session.current = null;
    if (frame.current !== null) cancelAnimationFrame(frame.current);
    frame.current = null;
    if (!s) return;
    s.node.port.onmessage = null;
    s.node.disconnect();
    for (const track of s.stream.getTracks()) track.stop();
    void s.context.close().catch(() => undefined);
  }, []);

  // Closing the page or the sheet while recording lets go of the microphone.
  useEffect(() => release, [release]);

  const finish = useCallback(() => {
    const s = session.current;
    if (!s) return;
    const samples = concatSamples(s.blocks);
    const sampleRateHz = s.context.sampleRate;
    const peak = s.peak;
    release();
    if (samples.length === 0) {
      setError("Nothing was recorded: the microphone sent no sound. Check that it is not muted and try again.");
      setState("error");
      return;
    }
    setRecorded({ wav: new Blob([encodeWav16(samples, sampleRateHz)], { type: "audio/wav" }), sampleRateHz, durationS: samples.length / sampleRateHz, peak });
    setState("recorded");
  }, [release]);

  const stop = useCallback(() => {
    const s = session.current;
    if (!s) return;
    setState("stopping");
    // The processor flushes its last block and answers "stopped".
    s.node.port.postMessage({ type: "stop" });
  }, []);

  const start = useCallback(async () => {
    setError(null);
    setRecorded(null);
    setElapsedS(0);
    setLevel(0);
    if (!window.isSecureContext || !navigator.mediaDevices?.getUserMedia) {
      setError("Recording needs a secure page (https:// or localhost). Open Ringdown over https on this device, or upload a recording made with another app.");
      setState("error");
      return;
    }
    if (typeof AudioWorkletNode === "undefined") {
      setError("This browser cannot capture raw audio (no AudioWorklet). Use a current Chrome, Edge, Firefox or Safari, or upload a WAV file.");
      setState("error");
      return;
    }
    setState("requesting");
    let stream: MediaStream;
    try {
      stream = await navigator.mediaDevices.getUserMedia({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false, channelCount: { ideal: 1 } },
      });
    } catch (e) {
      setError(microphoneErrorMessage(e));
      setState("error");
      return;
    }
    let context: AudioContext | null = null;
    try {
      context = new AudioContext();
      await context.audioWorklet.addModule(workletUrl);
      const source = context.createMediaStreamSource(stream);
      const node = new AudioWorkletNode(context, "ringdown-pcm-capture", { numberOfInputs: 1, numberOfOutputs: 1, outputChannelCount: [1] });
      // A silent path to the output keeps the graph pulling the processor in every browser.
      const mute = context.createGain();
      mute.gain.value = 0;
      source.connect(node);
      node.connect(mute);
      mute.connect(context.destination);
      const s: Session = { stream, context, node, blocks: [], frames: 0, peak: 0 };
      session.current = s;
      const maxFrames = MAX_RECORDING_S * context.sampleRate;
      node.port.onmessage = (event: MessageEvent<{ type: "samples"; samples: Float32Array } | { type: "stopped" }>) => {
        if (event.data.type === "stopped") {
          finish();
          return;
        }
        const block = event.data.samples;
        let peak = 0;
        for (let i = 0; i < block.length; i++) {
          const a = Math.abs(block[i]!);
          if (a > peak) peak = a;
        }
        s.blocks.push(block);
        s.frames += block.length;
        if (peak > s.peak) s.peak = peak;
        if (peak > levelPeak.current) levelPeak.current = peak;
        if (s.frames >= maxFrames && session.current === s) stop();
      };
      if (context.state === "suspended") await context.resume();
      setState("recording");
      // The meter follows the loudest block since the last screen refresh, falling back smoothly.
      let shown = 0;
      const tick = () => {
        const current = session.current;
        if (!current) return;
        shown = Math.max(levelPeak.current, shown * 0.85);
        levelPeak.current = 0;
        setLevel(shown);
        setElapsedS(current.frames / current.context.sampleRate);
        frame.current = requestAnimationFrame(tick);
      };
      frame.current = requestAnimationFrame(tick);
    } catch (e) {
      for (const track of stream.getTracks()) track.stop();
      void context?.close().catch(() => undefined);
      session.current = null;
      setError(`Recording could not start${e instanceof Error && e.message ? `: ${e.message}` : ""}.`);
      setState("error");
    }
  }, [finish, stop]);

  const reset = useCallback(() => {
    release();
    setRecorded(null);
    setError(null);
    setElapsedS(0);
    setLevel(0);
    setState("idle");
  }, [release]);

  return { state, error, level, elapsedS, recorded, start, stop, reset };
}
