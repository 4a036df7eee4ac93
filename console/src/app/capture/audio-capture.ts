import { joinBlocks, peakDbfs } from './wav-encode';

/** Why the browser could not give the page a microphone, in words a person can act on. */
export function inputRefusal(error: unknown): { title: string; advice: string } {
  const name = error instanceof DOMException || error instanceof Error ? error.name : '';
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return {
        title: 'The browser refused the microphone',
        advice:
          'Allow the microphone for this site (the icon at the left of the address bar, or the site settings), then press Open input again. If the browser never asked, the permission was refused earlier for this site.',
      };
    case 'NotFoundError':
      return {
        title: 'No input found',
        advice:
          'Connect the audio interface or microphone, check the system sees it, then press Open input again.',
      };
    case 'NotReadableError':
      return {
        title: 'The input is in use or cannot be read',
        advice: 'Close other programs that hold the interface exclusively, then press Open input again.',
      };
    case 'OverconstrainedError':
      return {
        title: 'The input cannot record the way measuring needs',
        advice:
          'Choose another input; this one refuses to turn its processing off or to open with these channels.',
      };
    default:
      return {
        title: 'The input could not be opened',
        advice: error instanceof Error ? error.message : String(error),
      };
  }
}

/** A played sweep and what came back: one array per recorded input channel. */
export interface Take {
  sampleRateHz: number;
  channels: Float32Array[];
}

/**
 * One open input and the browser's audio output: a live peak meter on every input channel, and a take
 * that records the input while the sweep plays on one output channel. The browser's voice processing
 * (echo cancellation, noise suppression, automatic gain) is turned off: each would change the response.
 */
export class AudioCapture {
  readonly context: AudioContext;
  readonly inputChannels: number;
  private readonly source: MediaStreamAudioSourceNode;
  private readonly analysers: AnalyserNode[];
  private readonly meterBuffer: Float32Array<ArrayBuffer>;
  private recorder: AudioWorkletNode | null = null;

  private constructor(
    private readonly stream: MediaStream,
    context: AudioContext,
  ) {
    this.context = context;
    const settings = stream.getAudioTracks()[0]?.getSettings() ?? {};
    this.inputChannels = Math.max(1, Math.min(8, settings.channelCount ?? 1));
    this.source = context.createMediaStreamSource(stream);
    this.source.channelCountMode = 'explicit';
    this.source.channelInterpretation = 'discrete';
    const splitter = context.createChannelSplitter(this.inputChannels);
    this.source.connect(splitter);
    this.analysers = Array.from({ length: this.inputChannels }, (_, i) => {
      const analyser = context.createAnalyser();
      analyser.fftSize = 2048;
      splitter.connect(analyser, i);
      return analyser;
    });
    this.meterBuffer = new Float32Array(2048);
    // The output carries every channel as it is: channel N of the sweep goes to output N.
    const destination = context.destination;
    if (destination.maxChannelCount > 0) destination.channelCount = destination.maxChannelCount;
    destination.channelCountMode = 'explicit';
    destination.channelInterpretation = 'discrete';
  }

  /** Opens an input (the default when `deviceId` is empty) with processing off, two channels if it has them. */
  static async open(deviceId: string): Promise<AudioCapture> {
    const stream = await navigator.mediaDevices.getUserMedia({
      audio: {
        ...(deviceId && { deviceId: { exact: deviceId } }),
        channelCount: { ideal: 2 },
        echoCancellation: false,
        noiseSuppression: false,
        autoGainControl: false,
      },
    });
    const context = new AudioContext();
    await context.resume();
    return new AudioCapture(stream, context);
  }

  /** How many output channels the browser offers (an interface's outputs, when it passes them). */
  get outputChannels(): number {
    return Math.max(1, this.context.destination.maxChannelCount);
  }

  /** Peak level of each input channel over the last 2048 samples, dBFS. */
  levels(): number[] {
    return this.analysers.map((analyser) => {
      analyser.getFloatTimeDomainData(this.meterBuffer);
      return peakDbfs(this.meterBuffer);
    });
  }

  /** Sends the output to another device, where the browser allows choosing one. */
  async useOutput(deviceId: string): Promise<boolean> {
    const withSink = this.context as AudioContext & { setSinkId?: (id: string) => Promise<void> };
    if (!withSink.setSinkId) return false;
    await withSink.setSinkId(deviceId);
    return true;
  }

  /**
   * Records every input channel while `sweep` plays on output channel `outputChannel` (0-based): a
   * short lead-in, the sweep, then `tailS` for the room's decay.
   */
  async take(sweep: AudioBuffer, outputChannel: number, tailS: number, leadInS = 0.3): Promise<Take> {
    const context = this.context;
    if (!this.recorder) {
      await context.audioWorklet.addModule('/capture-recorder.js');
      this.recorder = new AudioWorkletNode(context, 'iso-capture-recorder', {
        numberOfInputs: 1,
        numberOfOutputs: 1,
        channelCount: this.inputChannels,
        channelCountMode: 'explicit',
        channelInterpretation: 'discrete',
        processorOptions: { channels: this.inputChannels },
      });
      this.source.connect(this.recorder);
      // A silent path to the output keeps the recorder running in every browser.
      const mute = context.createGain();
      mute.gain.value = 0;
      this.recorder.connect(mute).connect(context.destination);
    }
    const recorder = this.recorder;
    const blocks: Float32Array[][] = Array.from({ length: this.inputChannels }, () => []);
    const done = new Promise<void>((resolve) => {
      recorder.port.onmessage = (event: MessageEvent<{ block?: Float32Array[]; done?: boolean }>) => {
        if (event.data.block) event.data.block.forEach((samples, c) => blocks[c].push(samples));
        if (event.data.done) resolve();
      };
    });
    recorder.port.postMessage('start');

    const player = context.createBufferSource();
    player.buffer = sweep;
    const merger = context.createChannelMerger(Math.max(1, this.outputChannels));
    player.connect(merger, 0, Math.min(outputChannel, this.outputChannels - 1));
    merger.connect(context.destination);
    const startAt = context.currentTime + leadInS;
    player.start(startAt);
    const ended = new Promise<void>((resolve) => (player.onended = () => resolve()));
    await ended;
    await new Promise((resolve) => setTimeout(resolve, tailS * 1000));
    recorder.port.postMessage('stop');
    await done;
    merger.disconnect();
    return { sampleRateHz: context.sampleRate, channels: blocks.map(joinBlocks) };
  }

  /** Stops the input and the audio. */
  async close(): Promise<void> {
    this.stream.getTracks().forEach((track) => track.stop());
    await this.context.close().catch(() => undefined);
  }
}
