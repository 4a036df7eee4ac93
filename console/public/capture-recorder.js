// Audio worklet of the capture page: copies every input channel, as it arrives, to the page in blocks
// of 4096 frames, untouched (no gain, no resampling), so the page can write the recording as a WAV file.
class IsoCaptureRecorder extends AudioWorkletProcessor {
  constructor(options) {
    super();
    this.channels = options.processorOptions.channels;
    this.blockFrames = 4096;
    this.buffers = Array.from({ length: this.channels }, () => new Float32Array(this.blockFrames));
    this.filled = 0;
    this.recording = false;
    this.port.onmessage = (event) => {
      if (event.data === 'start') {
        this.filled = 0;
        this.recording = true;
      } else if (event.data === 'stop') {
        this.flush();
        this.recording = false;
        this.port.postMessage({ done: true });
      }
    };
  }

  flush() {
    if (!this.filled) return;
    this.port.postMessage({ block: this.buffers.map((b) => b.slice(0, this.filled)) });
    this.filled = 0;
  }

  process(inputs) {
    const input = inputs[0];
    if (!this.recording || !input || !input.length) return true;
    const frames = input[0].length;
    let offset = 0;
    while (offset < frames) {
      const take = Math.min(frames - offset, this.blockFrames - this.filled);
      for (let c = 0; c < this.channels; c++) {
        const source = input[c] || input[0];
        this.buffers[c].set(source.subarray(offset, offset + take), this.filled);
      }
      this.filled += take;
      offset += take;
      if (this.filled === this.blockFrames) this.flush();
    }
    return true;
  }
}

registerProcessor('iso-capture-recorder', IsoCaptureRecorder);
