/**
 * Generated from the OpenAPI contract in openapi/ by scripts/contract-types.ts (openapi-typescript).
 * Do not edit: change the contract and run `npm run contract:types`. `npm run check` fails when
 * this file is stale.
 */
/* eslint-disable */
export type paths = {
    "/auth/invitations/accept": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Take up an invitation and choose a password
         * @description The token comes from the link an admin's invitation sent (`/accept-invitation?token=...`). It works
         *     once and for 7 days. The password needs 12 to 256 characters and must not contain the e-mail
         *     address. On success the user becomes active and is signed in (the answer sets the session cookie).
         */
        post: operations["acceptInvitation"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/auth/session": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Who is signed in
         * @description The console user behind the session cookie `isochron.sid`. The session rolls forward on every
         *     request and ends after 8 hours without one, 24 hours after signing in, when the user signs out,
         *     or at once when an admin disables the user.
         */
        get: operations["getSession"];
        put?: never;
        /**
         * Sign in to the console
         * @description Checks the e-mail address and password and starts a session: the answer sets the cookie
         *     `isochron.sid` (HttpOnly, SameSite=Strict, Secure in production) under a new session id.
         *     An unknown address, a wrong password, an account that has not accepted its invitation and a
         *     disabled account all get the same 401. After 5 failures for one account from one client address,
         *     or 20 from one address over all accounts, that address waits before its next attempt: 1 s, doubling
         *     with each further failure up to 15 minutes (429 with `Retry-After`). Guesses from elsewhere never
         *     hold up the real user's own address.
         *
         *     Every state-changing `/auth` request must carry `X-Requested-With: isochron-console`, and an
         *     `Origin` header, when sent, must be this service's own origin; otherwise 403.
         */
        post: operations["signIn"];
        /**
         * Sign out
         * @description Ends the session and clears the cookie. Answers 204 also when no one was signed in.
         */
        delete: operations["signOut"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/healthz": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Liveness: the process answers. */
        get: operations["getHealth"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/openapi.json": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** This document, as JSON. */
        get: operations["getOpenApiDocument"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/readyz": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Readiness: every dependency (database, and Redis when configured) answers.
         * @description Checks each dependency and names it in `dependencies`. The database (SQLite or PostgreSQL) must
         *     answer a read and take a write: a scratch row is written and removed again (at most once every
         *     two seconds; calls in between get the last outcome). Redis, when `REDIS_URL` is set, must answer a
         *     PING. Any dependency down answers 503 with the problem the failed requests get
         *     (`storage-full`, `storage-read-only`, `storage-unavailable` or `shared-state-unavailable`), with
         *     `Retry-After` and the same `dependencies` list.
         */
        get: operations["getReadiness"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/analysis/impulse-response": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Analyse an impulse response (WAV) — arrival, level, smoothed response, decay times, room modes
         * @description Upload one impulse response as `multipart/form-data` with the WAV file in the field `file`. Nothing is
         *     stored.
         *
         *     **Files accepted.** RIFF/RIFX WAV (and RF64/BW64 with 64-bit sizes), PCM 16, 24 or 32-bit integer or
         *     32-bit float (plain or WAVE_FORMAT_EXTENSIBLE), 44.1–192 kHz, mono or multichannel — give `channel`
         *     (0-based) to pick one channel of a multichannel file. Caps: **20 MiB** per file (413 above it) and
         *     **30 s** of audio. The chunk list is walked with every size checked against the file; only `fmt ` and
         *     `data` are decoded, and the counts declared in `cue `, `smpl`, `LIST`, `inst`, `bext` and `fact`
         *     chunks must fit their chunk. Float samples may exceed full scale up to ±1000 (+60 dBFS; a warning
         *     `aboveFullScale` says so, the values are not clipped); beyond that, NaN or infinity is refused. An
         *     empty, truncated, malformed, non-WAV, unsupported, too long or silent file (peak below −120 dBFS) is
         *     refused with a 422 problem of type `unusable-audio` naming `/body/file` whose `reason` says which
         *     (`emptyFile`, `notWav`, `truncated`, `malformed`, `unsupportedEncoding`, `unsupportedSampleRate`,
         *     `tooLong`, `tooShort`, `channelRequired`, `channelOutOfRange`, `invalidSamples`, `silent`).
         *
         *     **What comes back.**
         *     - `arrival`: the onset where the response first comes within 20 dB of its peak (ISO 3382-1 Annex A
         *       style; the threshold rises to 15 dB above the noise when the noise is within 35 dB of the peak),
         *       and the peak, in samples and milliseconds from the start of the file.
         *     - `level`: peak and RMS in dBFS (raw RMS, full scale = 1.0), energy `10·log10(Σh²)` in dB re a
         *       full-scale unit impulse, and the noise floor read from the last tenth of the file.
         *     - `frequencyResponse`: magnitude (dB re a full-scale unit impulse, so a single sample of 1.0 reads
         *       0 dB) and phase (degrees, with the arrival delay removed) on a log grid of 48 points per octave from
         *       20 Hz to 20 kHz (or Nyquist), fractional-octave smoothed by power averaging over
         *       `smoothingOctaves` (1/48..1 octave; default 1/12). The transform (fft.js) covers the response up to
         *       where its decay meets the noise, at most 2^20 samples.
         *     - `decay`: EDT, T20 and T30 in seconds, broadband and per octave band 63 Hz–8 kHz (IEC 61260-1 band
         *       edges, sixth-order Butterworth band filters), by Schroeder backward integration (ISO 3382-1/-2)
         *       truncated where the decay meets the noise (Lundeby's method) with the missing tail added. A time is
         *       `null` when the impulse-to-noise ratio is too small for its range (EDT 20 dB, T20 35 dB, T30 45 dB).
         *     - `room` (when `roomWidthM`, `roomLengthM` and `roomHeightM` are all given): volume, the Schroeder
         *       frequency `2000·sqrt(T/V)` from the broadband T30 (else T20, else EDT; null when none was measured
         *       or it lies outside 0.01–20 s), and the rectangular-room modes up to it (axial, tangential, oblique;
         *       up to 300 Hz without a Schroeder frequency), with the speed of sound at `temperatureC` (default
         *       20 °C). `modesLimit` says where and why the list ends: at most 500 modes are listed (`cutAtHz` is
         *       then the last one, with a `modesTruncated` warning), and a room so large that its lowest mode lies
         *       above its Schroeder frequency lists none (`noModesBelowLimit` warning).
         *     - `file`: what was read.
         */
        post: operations["analyzeImpulseResponse"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/analysis/sweep": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Turn a recorded sweep into an impulse response — linear and harmonic responses, distortion, then the full analysis
         * @description Upload the recording of a sweep made by `POST /v1/test-signals` (or any exponential sweep with known
         *     parameters) as `multipart/form-data`, with the WAV file in `file` and the sweep's parameters as fields
         *     (their defaults are the test-signal defaults). Nothing is stored. Same files and caps as
         *     `POST /v1/analysis/impulse-response`: **20 MiB** and **30 s** per file.
         *
         *     **Deconvolution.** `method` `regularizedDivision` (default): the recording's spectrum divided by the
         *     sweep's, regularised so nothing outside f1..f2 is amplified (Müller & Massarani, "Transfer-function
         *     measurement with sweeps", JAES 49(6), 2001); `inverseFilter`: convolution with Farina's inverse filter
         *     (AES 108th Convention, 2000, preprint 5093), which does not undo the sweep's fades, so the response
         *     reads low within the fade-in's frequencies. One real FFT of the smallest power of two holding the
         *     recording (recording + sweep for the inverse filter).
         *
         *     **What comes back.** Everything `POST /v1/analysis/impulse-response` answers, for the linear impulse
         *     response (its arrival counted from the sweep's first sample leaving the output, so with no
         *     reference it includes the interface's latency), plus:
         *     - `distortion`: the 2nd to 5th harmonics, each cut from where its response lands — `T·ln N/ln(f2/f1)`
         *       before the linear one — and given re the fundamental in dB and % against the fundamental frequency
         *       (f1 to f2/N, third-octave power averaged). Below about ten times f1 the harmonic responses of a sweep
         *       are less well separated and read high.
         *     - `timing` (with `referenceChannel`): the loopback's own arrival (the interface's latency) and the
         *       measured arrival counted from it, in samples and ms — comparable between channels, the basis for
         *       delay alignment.
         *     - `deconvolution`: the method and transform size.
         *
         *     A sweep sequence (one file sweeping several channels) is analysed one slot at a time: give the slot's
         *     `startS` as `offsetS` and the sequence's `periodS` as `lengthS`.
         */
        post: operations["analyzeSweepRecording"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/bass-management": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * High-passes, subwoofer feed and the headroom bass management needs
         * @description Channels with `bassManaged: true` get the crossover's high-pass and send their low end to the
         *     subwoofer(s); the crossover defaults to Linkwitz-Riley 4th order at 80 Hz (common practice), any part
         *     of it may be changed for the request (`crossover`) or for one channel (`channels[].crossover`).
         *     Channels whose `id` is `LFE`, `LFE1`, `LFE2`… feed the subwoofer directly at `lfeGainDb` (default +10 dB,
         *     the in-band replay gain of ITU-R BS.775 / BS.2051 note 5); the LFE content is band-limited at the
         *     source, so no low-pass is added (add one, commonly at 120 Hz, if yours is not). Other channels play
         *     full range.
         *
         *     Subwoofer inputs: `sharedLowPass` inputs are summed and pass `subwoofer.lowPass`; an input with its
         *     own crossover (`ownLowPass`) has its own `lowPass`; `direct` inputs (LFE) are added as they are.
         *
         *     `headroomDb = 20·log10(Σ 10^(gainDb/20))` over all inputs is how far the summed feed can rise above
         *     one full-scale channel when every input carries the same in-phase signal (the coherent worst case;
         *     7 managed channels + LFE at +10 dB → 20.1 dB). It is warned (`headroomLarge`) above
         *     `headroomWarningDb` (default 12 dB), and a caution about summing is always given when two or more
         *     inputs are summed.
         *
         *     With `subwooferCount` n > 1 each subwoofer gets the whole feed at `feedGainDb = −20·log10(n)`, so n
         *     subwoofers summing in phase at the listening position give the level of one (common practice);
         *     their delays and polarity still have to be set and checked by measurement. For LR2 (and
         *     Butterworth 2 or 6) the high-pass polarity is `inverted`.
         */
        post: operations["planBassManagement"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/biquads": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Second-order sections for parametric filters
         * @description Designs one normalised biquad section per filter from the *Audio EQ Cookbook* (W3C Working Group
         *     Note, 8 June 2021, after R. Bristow-Johnson). Sections mean
         *     `H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (1 + a1·z⁻¹ + a2·z⁻²)` (a0 = 1; note the `+a1, +a2` denominator —
         *     some processors expect a1 and a2 negated).
         *
         *     - `peaking`, `lowShelf` and `highShelf` need `gainDb` (−48..+24 dB); the other types refuse it.
         *     - Give at most one of `q` (0.025..100), `bandwidthOctaves` (0.01..8; peaking, bandPass and notch; the
         *       cookbook's bilinear approximation, within about 1 % up to sampleRateHz/8) or `shelfSlope` (0.01..1;
         *       shelves; S = 1 is the steepest slope that stays monotonic). Without any, Q = 1/√2 (or S = 1).
         *     - `bandPass` is the cookbook's constant 0 dB peak gain variant (the one Web Audio's `bandpass` uses).
         *     - `lowPass`/`highPass` Q is the plain Q (Web Audio's BiquadFilterNode takes Q in dB instead).
         *
         *     `frequencyHz` must lie below Nyquist (`sampleRateHz/2`); a frequency at or above it is a 422 naming
         *     the filter. With `response` the answer includes the cascade's magnitude (dB, a true zero reads
         *     −300), phase (degrees, wrapped to (−180, 180]) and group delay (ms) at the listed frequencies or on a
         *     log-spaced sweep (`fromHz`..`toHz`, both included, `pointsPerOctave` default 12, at most 4096 points,
         *     every point at or below Nyquist). `limits` only warns: filters beyond `eqBandsPerChannel`, or gains
         *     beyond `eqMaxBoostDb`/`eqMaxCutDb`, are still designed. Boosts carry a caution.
         */
        post: operations["designBiquads"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/crossovers": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Low-pass and high-pass cascades of a two-way crossover
         * @description `family` `butterworth` (order 1–8) or `linkwitzRiley` (order 2, 4 or 8), at `frequencyHz` (below
         *     `sampleRateHz/2`). Each output is a cascade of normalised second-order sections
         *     (`H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (1 + a1·z⁻¹ + a2·z⁻²)`); an odd Butterworth order adds one
         *     first-order section with `b2 = a2 = 0`. Butterworth sections have `Q_k = 1/(2·sin((2k−1)π/(2N)))`
         *     (as scipy.signal.butter), bilinear-transformed with pre-warping so every order is −3.01 dB at
         *     `frequencyHz`. A Linkwitz-Riley filter is a Butterworth of half the order, squared: −6.02 dB at
         *     `frequencyHz` on both outputs.
         *
         *     `highPassPolarity` is what to give the high-pass output for the flattest sum: `inverted` for orders
         *     2 and 6 (LR2, Butterworth 2 and 6), `normal` otherwise. Linkwitz-Riley outputs then sum to an
         *     all-pass (flat magnitude); odd Butterworth orders also sum flat; even Butterworth orders sum to
         *     +3.01 dB at the crossover frequency (warned as `sumNotFlat`). With `response`, the answer holds both
         *     outputs (the high-pass without its polarity) and their complex sum (with it).
         *
         *     An order outside the family's set is refused: above 8 or below 1 by the schema (400), 3, 5, 6 or 7
         *     for Linkwitz-Riley by the calculation (422 naming `/body/order`).
         */
        post: operations["designCrossover"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/delays": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Delays that make every loudspeaker arrive together
         * @description Each channel gives either its `distance` to the listening position (metres as a number, or a string
         *     with a length unit such as `"10.5 ft"`) or a measured `arrivalMs`; both kinds may be mixed. Arrival
         *     from distance is `distance / c`, with the speed of sound `c = 343.2·sqrt((t + 273.15)/293.15)` m/s
         *     (ISO 9613-1 form as in the pyfar library) from `temperatureC` (20 °C when absent), unless
         *     `speedOfSoundMps` is given instead.
         *
         *     The latest arrival is the `referenceChannel` and gets 0; every other channel gets
         *     `delayMs = latest arrival − its arrival`. `delaySamples` is `delayMs` rounded to the nearest sample
         *     at `sampleRateHz` (48000 when absent) and `quantizationErrorUs` is what that rounding leaves
         *     (`delaySamples/sampleRateHz − delayMs`, at most half a sample). A delay beyond `limits.delayMaxMs`
         *     is clamped (`clamped: true`, rounded down to whole samples) and warned: that loudspeaker will
         *     arrive early. ITU-R BS.2051-3 asks for alignment within 100 µs at the listening position.
         *
         *     A distance that is not a length (`"3 kg"`), or a value out of range, is refused with a 422 naming
         *     the field (e.g. `/body/channels/2/distance`).
         */
        post: operations["computeDelays"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/eq/fit": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Fit parametric EQ bands that bring a measured response toward a target curve
         * @description Fits peaking filters (Audio EQ Cookbook sections, a0 = 1,
         *     `H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (1 + a1·z⁻¹ + a2·z⁻²)`) that bring a measured response toward a
         *     target curve the way an engineer would, cut first.
         *
         *     **Level first.** The target is placed at the measurement's mean level over `levelReferenceHz`
         *     (default 500 Hz–2 kHz), so the EQ corrects shape, never overall level. When the measurement does not
         *     cover that band, the median of the fit band is used (with cuts only: the mean of the corrected
         *     response) and `levelReferenceNotMeasured` says so.
         *
         *     **Range.** Bands are placed from `fromHz` (default: the low end of the measurement, at least 20 Hz) up
         *     to the room's transition frequency `2000·√(T/V)` (Kuttruff, *Room Acoustics*) from `room.volumeM3`
         *     and `room.reverberationTimeS` (0.3 s assumed when absent, with a warning), or up to `toHz` when you
         *     give it; with neither, up to 200 Hz (`transitionFrequencyAssumed`). Above it the measurement at one
         *     point says little about what a listener hears, so nothing is corrected there unless you give
         *     `aboveTransition`: then a few broad, gentle bands (default 2, Q ≤ 1, cut ≤ 3 dB, boost ≤ 2 dB)
         *     follow the ½-octave-smoothed response.
         *
         *     **Targets.** `flat`, `tilt` (dB per octave through `pivotHz`), `lowFrequencyLift` (a shelf),
         *     `points` (interpolated linearly on a log-frequency axis, held beyond the ends) or `stored` (a target
         *     curve you stored under `/v1/target-curves`, by name; needs a key that may read them).
         *
         *     **Limits of the whole correction.** `maxBoostDb` (default 0: cuts only) and `maxCutDb` (default 12)
         *     bound the summed response of all bands at every frequency, not each band alone; `combined` reports
         *     the largest boost and cut the bands reach together, and the boost caution states that figure. The
         *     answer is never worse than no EQ: bands are removed while the residual would be.
         *
         *     **Band discipline.** A band must change the response by at least `minGainDb` (default 0.5 dB); no two
         *     bands lie within 1/6 octave (they are merged); a boost never overlaps a cut (within the mean of their
         *     half-gain widths); `maxBands`, `qRange` (default 0.5..10; Q is further capped where the measurement
         *     has too few points per octave, `qLimitedByResolution`), `bandFrequencyRangeHz` and `filterTypes` (no
         *     `peaking`: no bands) are kept. A dip is boosted only when boosts are allowed, it is at least 1/6
         *     octave wide at half depth, twice as deep as the highest peak is high, not a null (≥ 6 dB deep,
         *     ≤ 1/3 octave wide: reported with `nullNotBoosted`) and not where the positions disagree. Boost bands
         *     keep Q ≤ 3. Band values are rounded (0.1 Hz, 0.01 dB toward 0, 0.001 Q) before the sections are
         *     designed.
         *
         *     **Several microphone positions.** Give `positions` instead of `measured`: they are power-averaged
         *     on a 1/48-octave grid, each frequency weighs `1/(1 + (σ/2 dB)²)` in the fit (σ: the positions'
         *     standard deviation there), nothing is boosted where σ > 3 dB, and each position's predicted
         *     response and residual are returned.
         *
         *     **Explanation.** `explanation.bands` says what each band corrects (a peak at f, so many dB above the
         *     target); `explanation.notUsed` lists corrections considered and left out, with the reason;
         *     `explanation.octaveBands` gives the residual per IEC 61260-1 octave band before and after.
         *
         *     Deterministic: the same request always gives the same answer.
         */
        post: operations["fitEq"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/geometry": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Distances and angles of loudspeakers, checked against a layout
         * @description Room coordinates are metres from the floor's front-left corner seen from the listening position:
         *     x to the right, y toward the back wall, z up. For every loudspeaker the response gives its distance,
         *     azimuth (positive left) and elevation (positive up) seen from the listener and, with a `layout`, its
         *     deviation from the nominal direction and whether it lies within the permitted ranges of ITU-R
         *     BS.2051-3. Warnings report the standard's rules: permitted ranges, symmetry of left/right pairs
         *     beyond ±45° within 10°, and in systems G, I and J 30°..60° between the two middle-layer surrounds on
         *     one side. `angleToleranceDeg` (default 2°) widens every range to allow for measuring error — a
         *     product choice, not part of the standard; send 0 for the strict check.
         *
         *     A loudspeaker or listener outside the room, or a repeated channel id, is refused with a 422 naming
         *     the field. Mounting loudspeakers overhead is for qualified installers under local codes.
         */
        post: operations["computeGeometry"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/keys": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List API keys
         * @description Keys in order of creation, oldest first, a page at a time: pass the `id` of the last key of a page
         *     as `startingAfter` to get the next one. A caller with `keys:own` (a developer) sees its own keys;
         *     `keys:all` (an admin) sees everyone's and may filter by `ownerId`. Revoked keys are left out unless
         *     `includeRevoked=true`. A key is shown by its `prefix` and `lastFour`; the clear key is never shown
         *     again after its creation and its hash never leaves the server.
         */
        get: operations["listKeys"];
        put?: never;
        /**
         * Create an API key
         * @description Creates a key and answers with its clear value in `secret` — **the only time it is shown**; store it
         *     at once (the server keeps only an HMAC-SHA-256 of it). Send it as `Authorization: Bearer <secret>`.
         *
         *     A developer creates keys for itself with role `calculate` or `tuning`. An admin creates keys of any
         *     role for anyone (`ownerId`), sets `rateLimitPerMinute` (requests per minute; when absent the
         *     server's default applies) and may create `admin` keys for admin users. A key never does more than
         *     its owner may: viewers own no keys, developers no admin keys (422). `kind: test` makes an
         *     `iso_test_` key, which behaves the same and is easy to tell apart in logs and scripts.
         *
         *     One user may hold at most `MAX_ACTIVE_KEYS_PER_USER` keys (10 by default) that are neither revoked
         *     nor expired (409 beyond; revoke one first), and all of a user's keys together stay under the
         *     per-user ceiling `USER_RATE_LIMIT_PER_MINUTE`, whatever each key's own limit; `GET /v1/usage` shows both.
         */
        post: operations["createKey"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/keys/{keyId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * One API key
         * @description A key of the caller's (or anyone's, with `keys:all`). Other owners' keys answer 404.
         */
        get: operations["getKey"];
        put?: never;
        post?: never;
        /**
         * Revoke a key
         * @description Revokes the key at once: its very next request is refused with 401 `invalid_token`. Answers 200 with
         *     the revoked key (its `revokedAt` set). The key stays listed with `includeRevoked=true`, for the
         *     record; it cannot be brought back. Revoking a revoked key answers the same 200 and changes nothing.
         */
        delete: operations["revokeKey"];
        options?: never;
        head?: never;
        /**
         * Rename a key, change its rate limit or expiry
         * @description Sets any of `name`, `rateLimitPerMinute` (admins only; `null` returns to the server default) and
         *     `expiresAt` (`null` removes the expiry). Only an admin may move an expiry later or remove it; a
         *     key's owner may bring it nearer or set one where there was none (403 otherwise). An expired key
         *     stays expired: its expiry cannot be changed by anyone (409); create a new key instead. A revoked
         *     key cannot be changed (409). The change applies to the key's very next request.
         */
        patch: operations["updateKey"];
        trace?: never;
    };
    "/v1/layouts": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List the standard loudspeaker layouts
         * @description The ITU-R BS.2051-3 sound systems A–J, each with its loudspeakers' labels, nominal azimuth and
         *     elevation and permitted ranges, plus 9.1.6 as the subset of system H defined by the AOM IAMF
         *     specification. Trade names (5.1, 5.1.2, 5.1.4, 7.1, 7.1.4, 22.2, 9.1.6) are listed as `aliases` and
         *     are accepted wherever a layout is asked for. Azimuth is positive to the left, elevation positive up.
         */
        get: operations["listLayouts"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/layouts/{layoutId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * One loudspeaker layout
         * @description `layoutId` is a layout id (`bs2051-j`), a BS.2051 name (`4+7+0`), a system letter (`J`) or a trade
         *     alias (`7.1.4`, `9.1.6`), case-insensitive. A `+` in the path may be sent as is or as `%2B`.
         */
        get: operations["getLayout"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/levels": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Level trims that bring every channel to a reference level
         * @description Each channel gives either `measuredDb` (a level read at the listening position with the test signal —
         *     SPL, or any reference common to all channels) or its `distance`, from which its level is estimated by
         *     the inverse-square law `L(r) = L(1 m) − 20·log10(r / 1 m)` (direct sound only; such channels are
         *     flagged `estimated: true`, and a reading is preferred).
         *
         *     With `targetDb` every channel is trimmed to `targetDb + targetOffsetDb − level`. Without it the
         *     channels are aligned to the quietest one (lowest `level − targetOffsetDb`), so every trim is a cut.
         *     `targetOffsetDb` sets one channel apart from the others, e.g. +10 dB in-band for LFE or −3 dB for
         *     cinema surrounds (ISO 21727). Channels given by distance need `levelAt1mDb` (the level of a
         *     loudspeaker at 1 m) whenever they are compared with a target or with measured channels.
         *
         *     Trims outside `limits.trimMinDb..trimMaxDb` are clamped (`clamped: true`) and warned; `expectedDb`
         *     is the level after the trim. Level calibration uses loud test signals: the response always carries
         *     a caution, and another when a trim is a boost. Levels are in dB as given; this API does not define
         *     a full-scale convention.
         */
        post: operations["computeLevels"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/microphones": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List your measurement microphones
         * @description Your microphones, oldest first, with their calibrations. Microphones are private to their owner: no
         *     other user sees them, admins included. Cursor pagination.
         */
        get: operations["listMicrophones"];
        put?: never;
        /**
         * Store a measurement microphone with its calibration
         * @description A microphone (role `tuning`): `name`, `serial`, and optionally its calibration file's text in
         *     `calibrationText` — two or three columns (frequency in Hz, the microphone's deviation in dB, optional
         *     phase in degrees), separated by commas, tabs or spaces (semicolons with decimal commas too); blank
         *     lines, comment lines (`#`, `*`, `;`, `//`, `%`, `!`) and heading lines before the data are skipped.
         *     2 to 4096 rows, frequencies ascending, deviations within ±40 dB. A parse error is a 422 naming
         *     `/body/calibrationText` whose message names the line (`line 7: …`).
         *
         *     `sensitivity` is the data sheet's figure, either `mvPerPa` or `dbfsAt94DbSpl` (the RMS level the
         *     microphone reads through your interface at 94 dB SPL, dB re full scale as elsewhere in the API: raw
         *     RMS, a full-scale sine reads −3.01 dBFS). The second gives the dBFS-to-SPL offset `94 − dbfsAt94DbSpl`;
         *     mV/Pa alone cannot (the interface's gain is unknown) — record a calibrator for that
         *     (`POST /v1/microphones/{microphoneId}/calibrator`).
         *
         *     Name the microphone in a measurement upload or an analysis (`microphoneId`): its deviation is
         *     subtracted from the measured response (interpolated linearly on a log-frequency axis, held at the end
         *     values beyond the calibration's range, with a warning), and with an offset the response is also
         *     given in dB SPL.
         */
        post: operations["createMicrophone"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/microphones/{microphoneId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One of your microphones */
        get: operations["getMicrophone"];
        put?: never;
        post?: never;
        /**
         * Delete a microphone
         * @description Measurements corrected with it keep their results; a later request naming it gets a 422.
         */
        delete: operations["deleteMicrophone"];
        options?: never;
        head?: never;
        /**
         * Rename a microphone, replace its calibration or sensitivity, or change its notes
         * @description `null` removes the serial, notes, calibration or sensitivity. A new sensitivity in dBFS replaces an
         *     offset taken from a calibrator; removing the sensitivity removes an offset that came from it.
         */
        patch: operations["updateMicrophone"];
        trace?: never;
    };
    "/v1/microphones/{microphoneId}/calibrator": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Turn a calibrator recording into the microphone's dBFS-to-SPL offset
         * @description Upload a recording (WAV, the caps of the impulse-response upload) of a sound calibrator on the
         *     microphone — 1 kHz at 94 dB SPL (1 Pa) or 114 dB SPL (IEC 60942) — through the input and gain you
         *     measure with. The tone's RMS is read in the 1 kHz octave band (IEC 61260-1 band edges; the first and
         *     last 0.25 s left out, at least 1 s needed) and the offset `calibratorLevelDb − rmsDbfs` is stored
         *     (dB SPL = dBFS + offset), replacing any earlier one. It holds only for that input and gain: note the
         *     gain in `inputGain`. A recording whose strongest tone is not within ±5 % of 1 kHz, that reaches full
         *     scale or is silent is refused (422 `unusable-audio` naming `/body/file`). Noise or hum above the tone
         *     by more than 0.5 dB adds a warning.
         */
        post: operations["readMicrophoneCalibrator"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/outbox": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Mail the development mail server received
         * @description Development and tests only (404 in production, where mail is delivered by `SMTP_URL`). Admins only.
         *     The service runs its own mail server on the loopback interface and keeps the last 200 messages it
         *     received in memory, newest first: invitations and "a key was created for you" notices.
         */
        get: operations["listOutbox"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/plans": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Plan the corrections of a whole room
         * @description Everything a room needs, in one call: per channel the delay that aligns arrivals at the listening
         *     position (from a position, a distance or a measured `arrivalMs`; temperature-corrected speed of
         *     sound; whole samples at `sampleRateHz`), the trim to `targets.referenceDb` (or to the quietest
         *     channel; LFE channels are read 10 dB above the reference unless `targetOffsetDb` says otherwise),
         *     parametric EQ sections fitted toward the target curve where a `measuredResponse` is given (cut
         *     first: boosts only up to `targets.eqMaxBoostDb`, default 0), the high-pass of bass-managed channels,
         *     and the subwoofer path: low-pass, LFE gain, the headroom the summed feed needs, and a suggested
         *     subwoofer delay and polarity that line its low-pass up in phase with the mains' high-pass at the
         *     crossover. Positions are checked against the layout (ITU-R BS.2051-3) and its warnings included.
         *     Nothing is stored; `POST /v1/rooms/{roomId}/tunings` with `plan` stores a plan as a tuning.
         *     Deterministic: the same request always gives the same plan. At most 24 channels may carry a
         *     `measuredResponse` (each is one EQ fit; 24 covers every channel of the largest BS.2051 layout);
         *     a larger room is planned in parts. Runs on a worker thread and costs 20 rate-limit units.
         *
         *     **Cautions.** Level calibration plays loud test signals: start quietly and protect hearing. EQ
         *     boosts can overdrive amplifiers and drivers. Mounting loudspeakers overhead and running their
         *     cabling are for qualified installers under local codes.
         */
        post: operations["createPlan"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/processor-profiles": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List your processor profiles
         * @description The caller's profiles, oldest first (an admin sees every owner's). Cursor pagination.
         */
        get: operations["listProcessorProfiles"];
        put?: never;
        /**
         * Store a processor profile
         * @description What one kind of speaker processor accepts, in generic terms: its sample rates; delay unit (ms or
         *     samples), step and range; trim step and range; EQ bands per channel and filter types; frequency,
         *     gain and Q steps and ranges; and how it wants biquad coefficients written (order, whether a0 is
         *     written, the sign of the feedback terms, decimal places or float32). A room chooses one with
         *     `profileId`; its tunings are then checked against it on every write and exported for it. A step
         *     of 0 means the processor takes any value.
         */
        post: operations["createProcessorProfile"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/processor-profiles/{profileId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One processor profile */
        get: operations["getProcessorProfile"];
        /**
         * Replace a processor profile
         * @description The whole profile is replaced. Every room that uses it records the change, so the rooms' tunings
         *     made before it answer `stale` with the reason "processor profile … was edited".
         */
        put: operations["replaceProcessorProfile"];
        post?: never;
        /** Delete a processor profile no room uses */
        delete: operations["deleteProcessorProfile"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List your rooms
         * @description The caller's rooms, oldest first (an admin sees every owner's rooms). Cursor pagination.
         */
        get: operations["listRooms"];
        put?: never;
        /**
         * Store a room
         * @description A room with its layout, dimensions, listening position, loudspeaker positions and the processor's
         *     limits, in the coordinate convention of the API (metres from the floor's front-left corner seen from
         *     the listening position; x right, y toward the back wall, z up). The response carries the room's
         *     geometry (distances, angles, deviation from the layout, rule warnings). A loudspeaker outside the
         *     room, a repeated channel id or an unknown layout is refused with a 422 naming the field.
         */
        post: operations["createRoom"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One room, with its geometry */
        get: operations["getRoom"];
        put?: never;
        post?: never;
        /** Delete a room with its tunings and measurements */
        delete: operations["deleteRoom"];
        options?: never;
        head?: never;
        /**
         * Change a room
         * @description Fields given replace the stored ones (`loudspeakers` as a whole list). Stored tunings are not
         *     changed, but a change of the listening position, a loudspeaker's position, the limits, the sample
         *     rate or the processor profile makes every tuning made before it answer `stale` with the reasons.
         */
        patch: operations["updateRoom"];
        trace?: never;
    };
    "/v1/rooms/{roomId}/measurements": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List a room's measurements
         * @description The room's measurements, oldest first, without their arrays (`summary` instead of `result`). Filter by
         *     `channel`, and by `stage`: `before` (taken without a tuning loaded, what plans use) or `after` (taken
         *     with a tuning loaded, what verification uses).
         */
        get: operations["listMeasurements"];
        put?: never;
        /**
         * Store a measurement of one loudspeaker at one microphone position
         * @description Stores one measurement of the loudspeaker `channel` (a loudspeaker id of the room, e.g. `M+030`) at
         *     microphone position `micPosition` (free text up to 32 characters; default `"1"`). Three kinds:
         *
         *     - **Impulse response** — `multipart/form-data` with a WAV file in `file` (the formats and caps of
         *       `POST /v1/analysis/impulse-response`: PCM 16/24/32-bit or float 32, 44.1–192 kHz, at most 20 MiB
         *       and 30 s). `fileChannel` picks the channel of a multichannel file. The file is analysed on arrival
         *       (arrival, level, smoothed response, decay times, and the room's modes from its stored dimensions)
         *       and the analysis is stored; the audio itself is not kept.
         *     - **Recorded sweep** — the same multipart upload with `fileKind: sweepRecording`: the recording of an
         *       exponential sweep (from `POST /v1/test-signals`, or any sweep with known parameters) plus the sweep's
         *       parameters `startHz`, `endHz`, `durationS`, `fadeInS`, `fadeOutS`, `levelDbfs` (the test-signal
         *       defaults when left out: 20 Hz, 20 kHz, 10 s, 0.05 s, 0.01 s, −12 dBFS), `method`, and for one slot
         *       of a sequence `offsetS`/`lengthS`; `referenceFileChannel` names the loopback channel. It is
         *       deconvolved and analysed on arrival exactly as `POST /v1/analysis/sweep` does, and stored as an
         *       impulse-response measurement (`kind: impulseResponse`, `source.fileKind: sweepRecording` with the
         *       sweep in `source.sweep`) whose `result` also holds `deconvolution`, `distortion` and, with a
         *       loopback, `timing` and `timingReference` (the loopback's arrival, so plans use the arrival counted
         *       from it and the interface's latency cancels; `summary.arrivalFromReferenceMs` shows it). Sweep
         *       parameters on any other file are refused (422 naming the field), as is `timingReferenceMs` on a
         *       sweep. Without `fileKind` a WAV file is an impulse response and anything else a text frequency
         *       response.
         *     - **Frequency response** — either the same multipart upload with a text file (columns: frequency
         *       in Hz, magnitude in dB, optional phase in degrees; separated by commas, semicolons, tabs or spaces;
         *       lines starting with `#`, `*`, `;`, `//`, `%` or `!` and headings before the data are skipped;
         *       decimal commas allowed with semicolons or tabs), or JSON with `kind: frequencyResponse` and the
         *       response as arrays (`response`) or as that text (`text`).
         *     - **SPL reading** — JSON with `kind: spl`, `splDb`, `weighting` (`A`, `C` or `Z`; default `C`, the
         *       weighting calibration references use) and `timeWeighting` (`slow` or `fast`; default `slow`).
         *
         *     The measurement is analysed and checked completely before anything is written, and written in one
         *     step: a refused upload leaves nothing behind. A bad file is a 422 naming `/body/file` (audio problems
         *     have type `unusable-audio` and a `reason`); an unknown channel is a 422 naming `/body/channel`.
         */
        post: operations["createMeasurement"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}/measurements/{measurementId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Read one measurement with its analysis */
        get: operations["getMeasurement"];
        put?: never;
        post?: never;
        /** Delete one measurement */
        delete: operations["deleteMeasurement"];
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}/measurements/average": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Spatial average of one channel's responses over its microphone positions
         * @description The power average `10·log10(mean(10^(L/10)))` of every stored frequency response and impulse-response
         *     analysis of `channel`, each first brought to a common grid of 48 points per octave (1/48-octave power
         *     smoothing) over the range all of them cover. SPL readings are not included. 404 when the channel has
         *     no responses. Impulse-response analyses are in dB re full scale and frequency responses in the level
         *     their tool wrote, so the two are never averaged together: when a channel has both, name `kind`.
         */
        get: operations["averageMeasurements"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}/plans": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Plan a stored room from its geometry, limits and measurements
         * @description The whole-room plan of `POST /v1/plans` (the same engine), with every input taken from what is
         *     stored: layout, dimensions, listening position, loudspeaker positions, limits and sample rate from
         *     the room; per channel the measured arrival, the SPL reading and the averaged response from its
         *     measurements. The body only overrides: `targets`, `temperatureC`, `sampleRateHz`, which channels
         *     are `bassManaged`, and which `measurements` to use.
         *
         *     **Where each number comes from** (`channels[].sources`, each with the `measurementIds` that fed it):
         *     - `delay.source`: `measuredArrival` — the arrival in the newest impulse response of the channel at
         *       the reference position, relative to the capture's timing reference (loopback) when it has one — or
         *       `geometry` (distance from the stored positions, temperature-corrected speed of sound). Arrivals
         *       are used only when every channel has one and all or none of them have a timing reference (captures
         *       without a common reference are otherwise not comparable); a warning says why they were not.
         *     - `level.source`: `splReading` — the newest SPL reading at the reference position — or `none`.
         *     - `response.source`: `responseAverage` — the power average over every microphone position (newest
         *       per position) of the channel's frequency responses or, if it has more of them, its
         *       impulse-response analyses (never both: their levels are on different scales) — or `none`. EQ is
         *       fitted only when the room's limits give `eqBandsPerChannel`.
         *     - `subwoofer.integration.source`: `measuredResponses` when the subwoofer and at least one
         *       bass-managed channel have frequency responses with phase at the reference position (measured
         *       with the same timing reference); then the subwoofer delay (0 to the room's `delayMaxMs`, at most
         *       100 ms, whole samples) and polarity are chosen so that the sum with the crossover filters applied is loudest
         *       and smoothest from one octave below to one octave above the crossover (score = mean level −
         *       RMS deviation, averaged over the measured mains), with the summed response and up to three
         *       runners-up. Otherwise `geometry`: the phase-at-the-crossover suggestion of `POST /v1/plans`, and
         *       `reason` says what to measure.
         *
         *     The reference position is `measurements.micPosition`, or else the position with the most arrivals
         *     and SPL readings. Measurements taken with a tuning loaded (`stage: after`) are verification data
         *     and are left out unless listed in `measurements.include`. `measurements.used` and `.ignored` (with
         *     the reason) account for every measurement of the room.
         *
         *     **Budget.** Like `POST /v1/plans`, one plan fits EQ to at most 24 channels' responses (the channels
         *     of the largest ITU-R BS.2051 layout); a room whose measurements give more is refused with a 422
         *     naming `/body/measurements/exclude` and the channels over the budget. Leave out the responses of
         *     channels that need no EQ there, or plan the room in parts. The plan counts as 20 requests against
         *     the rate limits, as `POST /v1/plans` does.
         *
         *     `store: true` saves the plan as a new tuning (version 1, origin `plan`) in the same call, with what
         *     it promises (reference level, expected levels, corrected ranges) for `GET
         *     /v1/tunings/{tuningId}/verification`; the stored tuning is in `tuning`.
         *
         *     **Cautions.** Level calibration plays loud test signals: start quietly and protect hearing. EQ
         *     boosts can overdrive amplifiers and drivers. Mounting loudspeakers overhead and running their
         *     cabling are for qualified installers under local codes.
         */
        post: operations["planStoredRoom"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}/report": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Print-ready report of a room and its tuning (HTML)
         * @description One self-contained HTML page for the client (no external assets; print it or save it as PDF from a
         *     browser): the room and its layout drawn from above with every loudspeaker and its nominal direction,
         *     distances, angles and deviation from ITU-R BS.2051-3, the tuning's settings per channel, the
         *     response of each channel's correction, warnings, cautions, the date and who tuned it. Uses the
         *     most recently changed tuning of the room unless `tuningId` (and `version`) are given.
         */
        get: operations["getRoomReport"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/rooms/{roomId}/tunings": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List a room's tunings
         * @description Each tuning at its latest version, oldest tuning first. Cursor pagination.
         */
        get: operations["listRoomTunings"];
        put?: never;
        /**
         * Store a tuning for a room
         * @description Either from settings per channel (`channels`, with `delayMs`, `trimDb`, `polarity`, `eq` filters,
         *     `highPass` and `bassManaged`; filters are stored as parameters and designed at any rate on export),
         *     or from a whole-room plan (`plan`, the body of `POST /v1/plans` in which layout, room, listener,
         *     limits, sample rate and loudspeaker positions default to the stored room's). A plan-made tuning
         *     takes the plan's suggested subwoofer delay and polarity; its warnings come back as `planWarnings`.
         *     Give exactly one of `channels` or `plan`. The tuning starts at version 1.
         */
        post: operations["createRoomTuning"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/target-curves": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List your stored target curves
         * @description The caller's target curves, oldest first (an admin sees every owner's). Cursor pagination.
         */
        get: operations["listTargetCurves"];
        put?: never;
        /**
         * Store a target curve to reuse by name
         * @description A target response given as points (level in dB at each frequency, frequencies strictly ascending),
         *     interpolated linearly on a log-frequency axis and held beyond the first and last point. Use it in
         *     `POST /v1/eq/fit` and `POST /v1/plans` as `target: { kind: stored, name }`. Names are unique per
         *     owner (409 when taken).
         */
        post: operations["createTargetCurve"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/target-curves/{targetCurveId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One stored target curve */
        get: operations["getTargetCurve"];
        put?: never;
        post?: never;
        /**
         * Delete a target curve
         * @description Fits and plans that named it keep their results; a later request naming it gets a 422.
         */
        delete: operations["deleteTargetCurve"];
        options?: never;
        head?: never;
        /** Rename a target curve or change its points or notes */
        patch: operations["updateTargetCurve"];
        trace?: never;
    };
    "/v1/test-signals": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Make a test signal — exponential sweep, pink noise or a sweep sequence for a whole layout (WAV)
         * @description Answers the signal as a WAV file (`audio/wav`; 16 or 24-bit PCM or 32-bit float, 44.1–192 kHz), or,
         *     with `Accept: application/json`, its description (the same numbers, no samples). Nothing is stored.
         *     Levels: ±1.0 is 0 dBFS. A sweep's `levelDbfs` is its sine peak; pink noise's `levelDbfs` is its raw
         *     RMS, on which a full-scale sine reads −3.01 dBFS (`rmsDbfsSineReferenced` gives the AES17-style
         *     reading, 3.01 dB higher). Files are at most **64 MiB**; a longer request is refused naming
         *     `/body/durationS`.
         *
         *     - `sweep`: exponential sine sweep `x(t) = A·sin(2π·f1·L·(e^(t/L) − 1))`, `L = T/ln(f2/f1)` (Farina,
         *       AES 108th Convention, 2000, preprint 5093; Farina, AES 122nd Convention, 2007), from `startHz` to
         *       `endHz` (at most Nyquist, at least an octave) over `durationS`, half-Hann fades `fadeInS` and
         *       `fadeOutS`, then `silenceAfterS` of digital silence for the room's decay. The description gives
         *       where each harmonic's response will land before the linear one: `T·ln N/ln(f2/f1)`.
         *     - `pinkNoise`: noise with power density ∝ 1/f (−3.01 dB per octave, equal energy per fractional-octave
         *       band), shaped in the frequency domain with seeded random phases (`seed`; the same seed gives the
         *       same file), in the `band` `full` 20 Hz–20 kHz, `mid` 500 Hz–2 kHz (loudspeaker level setting) or
         *       `low` 20–80 Hz (subwoofers) — these bands are common practice, not a standard. `levelDbfs` is the
         *       RMS (default −20 dBFS RMS, the common reference); the crest factor is reported, and a level whose
         *       peak would clip is refused.
         *     - `sweepSequence`: one multichannel file with the sweep on each of `channels` in turn, each followed
         *       by `gapS` of silence — make the gap longer than the room's decay time (T60) so one response has died
         *       away before the next sweep starts. With `timingReference: true` one more channel (the last)
         *       carries every sweep: wire it straight back to an input (loopback) and give that input as
         *       `referenceChannel` to `POST /v1/analysis/sweep`, so the interface's latency drops out of the arrivals.
         *
         *     Fields of another kind are refused (400), not ignored.
         *
         *     **Caution.** Every answer carries the test-signal cautions — in `cautions` of the JSON description and
         *     in the `Test-Signal-Caution` header of the WAV file: start quietly, protect hearing, protect drivers.
         */
        post: operations["createTestSignal"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One tuning (latest version, or `version`) */
        get: operations["getTuning"];
        put?: never;
        post?: never;
        /** Delete a tuning and all its versions */
        delete: operations["deleteTuning"];
        options?: never;
        head?: never;
        /**
         * Edit a tuning (creates a new version)
         * @description Every edit creates a new, immutable version; earlier versions stay readable and restorable.
         *     `channels` are merged by `id` (fields given replace the stored ones; a new id is added);
         *     `removeChannels` drops channels; `subwoofer` replaces the subwoofer path (`null` removes it).
         */
        patch: operations["updateTuning"];
        trace?: never;
    };
    "/v1/tunings/{tuningId}/duplicate": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Duplicate a tuning to try a variant
         * @description A new tuning (version 1) with the settings of the source's latest version, or of `version`.
         */
        post: operations["duplicateTuning"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/export": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Export a tuning for a processor (JSON or CSV)
         * @description The tuning as one processor takes it, for the processor profile `profile` (default: the room's
         *     profile; without one, whole-sample delays and the API's own coefficient convention at full
         *     precision). Every value is rounded to the profile's steps; delay in ms and in samples come from the
         *     same quantised value (quantised in the profile's delay unit). EQ is given as parameters (type,
         *     frequency, gain, Q — a band stored with a bandwidth or shelf slope gets its equivalent Q) and as
         *     coefficients designed from those rounded parameters (Audio EQ Cookbook) in the profile's layout
         *     (`coefficientLayout`: order, a0 written or not, sign of the feedback terms, decimal places or
         *     float32). Also the high-passes and the subwoofer low-pass (Linkwitz-Riley or Butterworth
         *     sections), the routing of every bass-managed channel and the LFE into the subwoofer with gains, the
         *     subwoofer's delay and polarity, and a header (tuning id and version, room, sample rate, profile,
         *     creation time, Isochron version, cautions). Per channel, `eqRounding` says what the rounding cost:
         *     the largest deviation in dB between the exported EQ and the EQ designed from the stored
         *     parameters, on a 1/48-octave grid from 20 Hz to 20 kHz (or 0.45·fs) and at every band's frequency.
         *     A tuning whose room changed since says so first (`stale`, and the first row of the CSV).
         *     Settings outside the profile (a sample rate it does not run at, a delay beyond its range) are
         *     refused with 422 naming `/query/profile` or `/query/sampleRateHz`, the setting and the limit;
         *     nothing is clamped. CSV: a `field,value` header block, a blank line, the parameters table, a blank
         *     line, the coefficients table; text cells that a spreadsheet would run as a formula are made inert
         *     (OWASP CSV injection).
         */
        get: operations["exportTuning"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/verification": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Check the "after" measurements against what the tuning promised
         * @description Compares the measurements stored with `tuningId`, `tuningVersion` = `version` (default the latest)
         *     and `stage: after` with what that version promised (a tuning stored from a plan keeps its
         *     reference level, expected levels, target curve and corrected ranges; for one typed in by hand, give
         *     `referenceDb`, or levels are checked for matching against their median). Per channel:
         *
         *     - **arrival** — the arrival in the newest impulse response at the reference position (relative to
         *       its timing reference when it has one) minus the median of the checked channels; and the
         *       **arrival spread** (latest − earliest). Subwoofer outputs have no arrival line: they are timed
         *       by the sum at the crossover.
         *     - **level** — the newest SPL reading minus the promised level (the reference; LFE channels 10 dB
         *       above it).
         *     - **response** — the power average over the positions of the "after" responses against the target
         *       curve over the corrected range, level removed (the level has its own line): RMS and largest
         *       deviation, 1/48-octave grid.
         *     - **crossoverSum** — for a bass-managed channel (its "after" response holds the subwoofer, through
         *       the bass management): the deepest dip below the mean from one octave below to one octave above
         *       the crossover, 1/6-octave smoothed.
         *
         *     Each line passes within its tolerance, warns past 80 % of it, fails beyond it, or is `notMeasured`
         *     (which does not count). The verdict is the worst line, or `incomplete` when nothing was measured.
         *     `tolerances` lists every tolerance used, its default, whether the caller set it, and where it comes
         *     from (`published` with the document, or `commonPractice`). The version's sign-off, if any, is in
         *     `signOff`.
         */
        get: operations["getTuningVerification"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/versions": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List a tuning's versions
         * @description Oldest first; `startingAfter` is a version number.
         */
        get: operations["listTuningVersions"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/versions/{version}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One version of a tuning */
        get: operations["getTuningVersion"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/versions/{version}/restore": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Restore a version (as a new version)
         * @description Copies the settings of `version` into a new latest version; nothing is overwritten.
         */
        post: operations["restoreTuningVersion"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/{tuningId}/versions/{version}/sign-off": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        /**
         * Sign off a verified tuning version
         * @description Stores the engineer's sign-off with the tuning version: who, the day, the reference level and its
         *     weighting, the microphone and the positions measured, and notes. The verification verdict at the
         *     time of signing is stored with it (`verdict`), so a later report shows what was signed. Signing
         *     again replaces the sign-off. The settings of a version never change; only its sign-off may.
         */
        put: operations["signOffTuningVersion"];
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/tunings/compare": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Compare two tunings channel by channel
         * @description Differences right minus left for every channel: delay, trim, polarity, bass management, high-pass,
         *     EQ, and the largest difference between the two corrections' magnitude responses (trim, EQ and
         *     crossover filters) from 20 Hz to 20 kHz at 1/6 octave. Either side may be any version.
         */
        get: operations["compareTunings"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/usage": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Metered calls per key, route and time
         * @description Every authenticated `/v1` call is counted per key (or, for console calls, per signed-in user), route
         *     template (`POST /v1/biquads`, `GET /v1/keys/{keyId}`), status class and hour. Counts are kept in
         *     memory and written to the database every few seconds (`USAGE_FLUSH_INTERVAL_MS`, 5 s by default) and
         *     at shutdown, so the latest seconds may not show yet. Calls refused before a caller is known (401)
         *     or by the rate limit (429) are not counted.
         *
         *     `groupBy` chooses the rows: `hour` (default) or `day` give one row per key, route and hour or UTC
         *     day; `route` one row per route over the whole range (key columns null); `key` one row per key
         *     (route and bucket null). `errorCount` is the part of `count` answered with 4xx or 5xx.
         *
         *     The range is `[from, to)` on the hours' starts; by default the 7 days before now, at most 400 days,
         *     and at most 10,000 rows (422 beyond: narrow the range or group coarser). A caller with `usage:own`
         *     sees its own keys' usage; `usage:all` (admins, viewers) sees everyone's and may filter by `userId`.
         *
         *     `limits` gives the limits in force: the default per-key rate limit (a key may have its own), the
         *     ceiling per user across all their keys and their console session, the most active keys one user
         *     may hold, and, when the report covers one user (your own, or `userId`), how many they hold now.
         *
         *     Send `Accept: text/csv` for the same rows as CSV (columns `bucket,keyId,keyName,userId,route,count,errorCount`).
         */
        get: operations["getUsage"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/users": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * List console users
         * @description Admins only. Oldest first; page with `limit` and `startingAfter` (the last id of the previous page).
         */
        get: operations["listUsers"];
        put?: never;
        /**
         * Invite a console user
         * @description Admins only. Creates the user with status `invited` and e-mails a one-time link to choose a
         *     password, valid for 7 days. The link is also returned here, so it can be passed on by hand when
         *     `emailSent` is false (no mail server, or it refused the message). E-mail addresses are stored in
         *     lower case. A console session must send `X-Requested-With: isochron-console`.
         */
        post: operations["inviteUser"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/users/{userId}": {
        parameters: {
            query?: never;
            header?: never;
            path: {
                userId: components["parameters"]["UserId"];
            };
            cookie?: never;
        };
        /**
         * One console user
         * @description Admins only.
         */
        get: operations["getUser"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        /**
         * Change a user's role, name or status
         * @description Admins only. `status: disabled` refuses the user's sign-ins and ends their sessions at their next
         *     request; `status: active` lifts that (a user who never accepted the invitation goes back to
         *     `invited`). Admins cannot change their own role or disable themselves (409). Send `name: null`
         *     to clear the name. A console session must send `X-Requested-With: isochron-console`.
         *
         *     A role change reaches the user's API keys at their next request: a key never does more than its
         *     owner's current role allows (an `admin` key of a developer acts as `tuning`; a viewer's keys are
         *     refused with 403). Keys are not revoked, and a later promotion gives a key back at most the role it
         *     was created with. After a role change the answer lists in `keys` every live key whose effective
         *     role moved; the audit log records the same.
         */
        patch: operations["updateUser"];
        trace?: never;
    };
    "/v1/users/{userId}/invitations": {
        parameters: {
            query?: never;
            header?: never;
            path: {
                userId: components["parameters"]["UserId"];
            };
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Send a new invitation link
         * @description Admins only, for a user whose status is still `invited` (the first link expired or went astray).
         *     Earlier links of that user stop working. Answers like `POST /v1/users`.
         */
        post: operations["reissueInvitation"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/v1/users/me": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * The calling user
         * @description The signed-in console user, or the owner of the calling API key. Any role.
         */
        get: operations["getCurrentUser"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
};
export type webhooks = Record<string, never>;
export type components = {
    schemas: {
        /** @description Ask for broad, gentle corrections above the transition; each within these limits. */
        AboveTransition: {
            /**
             * @description They count toward maxBands.
             * @default 2
             */
            maxBands?: number;
            /**
             * @description Never more than the request maxBoostDb.
             * @default 2
             */
            maxBoostDb?: number;
            /**
             * @description Never more than the request maxCutDb.
             * @default 3
             */
            maxCutDb?: number;
            /** @default 1 */
            qMax?: number;
            /** @description Default: the top of the measurement, at most 20 kHz. */
            toHz?: number;
        };
        /**
         * @description What an impulse response's analysis finds (arrival, level, response, decay, room modes, decay plots),
         *     without the uploaded file's details; a stored impulse-response measurement keeps this.
         */
        AnalysedImpulseResponse: {
            arrival: {
                arrivalMs: number;
                arrivalSample: number;
                peakMs: number;
                peakSample: number;
                /** @description Onset threshold used, dB re the peak. */
                thresholdDb: number;
            };
            decay: components["schemas"]["DecayTimes"] & {
                bands: (components["schemas"]["DecayTimes"] & {
                    /** @description Exact IEC 61260-1 mid-band frequency. */
                    centreHz: number;
                    nominalHz: number;
                })[];
                impulseToNoiseDb: number;
                /** @description Where the decay meets the noise, ms after the arrival. */
                truncationMs: number;
            };
            durationS: number;
            frequencyResponse: {
                frequenciesHz: number[];
                magnitudeDb: number[];
                phaseDeg: number[];
                smoothingOctaves: number;
                /**
                 * @description With a microphone that has a dBFS-to-SPL offset: the level a sine at `splForPeakDbfs` peak
                 *     would produce at the microphone, dB SPL (`magnitudeDb + splForPeakDbfs − 3.01 + offset`; the
                 *     sweep's level for a recorded sweep, 0 dBFS for an impulse response).
                 */
                splDb?: number[];
                splForPeakDbfs?: number;
            };
            level: {
                energyDb: number;
                noiseFloorDbfs: number;
                peakDbfs: number;
                peakToNoiseDb: number;
                rmsDbfs: number;
            };
            microphone?: components["schemas"]["MicrophoneCorrection"];
            room?: {
                modes: {
                    frequencyHz: number;
                    /** @enum {unknown} */
                    kind: "axial" | "tangential" | "oblique";
                    nx: number;
                    ny: number;
                    nz: number;
                }[];
                /**
                 * @description Where the mode list ends and why: at the Schroeder frequency (`schroederFrequency`), or at 300 Hz
                 *     when no decay time gave one (`noSchroederFrequency`); `found` modes lie below that limit and the
                 *     lowest `listed` (at most 500) are listed — when fewer, `cutAtHz` is the last one listed. A room
                 *     whose lowest mode lies above its Schroeder frequency (a very large room) lists none.
                 */
                modesLimit: {
                    cutAtHz: number | null;
                    found: number;
                    listed: number;
                    lowestModeHz: number;
                    /** @enum {unknown} */
                    reason: "schroederFrequency" | "noSchroederFrequency";
                };
                modesUpToHz: number;
                schroederFrequencyHz: number | null;
                speedOfSoundMps: number;
                volumeM3: number;
            };
            sampleRateHz: number;
            spectrogram?: components["schemas"]["DecayPlot"];
            warnings: components["schemas"]["Warning"][];
            waterfall?: components["schemas"]["DecayPlot"];
        };
        /** @description `[min, max]` in degrees; an azimuth range runs anticlockwise (leftward) from min to max. A single value in the standard is `[v, v]`. */
        AngleRange: number[];
        ApiKey: {
            /** Format: date-time */
            createdAt: string;
            /** @description Who created it; null when made by the operator command line. */
            createdById: string | null;
            /** Format: date-time */
            expiresAt: string | null;
            id: string;
            /** @enum {string} */
            kind: "live" | "test";
            /** @description The last four characters of the key. */
            lastFour: string;
            /**
             * Format: date-time
             * @description Last use, as of the latest usage flush (every few seconds).
             */
            lastUsedAt: string | null;
            name: string;
            ownerId: string;
            /** @description The first characters of the key, e.g. `iso_live_Q7pz`. */
            prefix: string;
            /** @description The key's own limit; null means the server default. */
            rateLimitPerMinute: number | null;
            /** Format: date-time */
            revokedAt: string | null;
            role: components["schemas"]["KeyRole"];
            /** @enum {string} */
            status: "active" | "expired" | "revoked";
            /** Format: date-time */
            updatedAt: string;
        };
        /** @description The processor's setting steps; bands are rounded to them (frequency and Q to the nearest step inside their ranges, gain toward 0 dB, so no limit is crossed). Default 0.1 Hz, 0.01 dB, 0.001. */
        BandSteps: {
            /** @description Hertz, or octaves with frequencyStepUnit octave. */
            frequencyHz?: number;
            /**
             * @default hz
             * @enum {string}
             */
            frequencyStepUnit?: "hz" | "octave";
            gainDb?: number;
            q?: number;
        };
        /** @description Any part of the crossover; the rest comes from the request's crossover or from LR4 at 80 Hz. */
        BassCrossover: {
            family?: components["schemas"]["CrossoverFamily"];
            frequencyHz?: number;
            order?: number;
        };
        BassManagementRequest: {
            /** @description Each channel `id` (its BS.2051 label) must be unique; `LFE`, `LFE1`, `LFE2`… are LFE channels. */
            channels: {
                /** @default false */
                bassManaged?: boolean;
                crossover?: components["schemas"]["BassCrossover"];
                id: components["schemas"]["ChannelLabel"];
            }[];
            crossover?: components["schemas"]["BassCrossover"];
            /** @default 12 */
            headroomWarningDb?: number;
            /** @default 10 */
            lfeGainDb?: number;
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            /** @default 1 */
            subwooferCount?: number;
        };
        BassManagementResult: {
            cautions: components["schemas"]["Caution"][];
            channels: {
                highPass?: components["schemas"]["FilterPath"] & {
                    /** @enum {string} */
                    polarity: "normal" | "inverted";
                };
                id: string;
                /** @enum {string} */
                role: "managed" | "fullRange" | "lfe";
            }[];
            headroomDb: number;
            sampleRateHz: number;
            subwoofer: {
                count: number;
                /** @description Gain from the feed to each subwoofer: −20·log10(count). */
                feedGainDb: number;
                inputs: {
                    gainDb: number;
                    id: string;
                    lowPass?: components["schemas"]["FilterPath"];
                    /** @enum {string} */
                    route: "sharedLowPass" | "ownLowPass" | "direct";
                }[];
                lowPass: components["schemas"]["FilterPath"];
            };
            warnings: components["schemas"]["Warning"][];
        };
        /** @description One normalised second-order section (a0 = 1). A first-order section has b2 = a2 = 0. */
        BiquadSection: {
            a1: number;
            a2: number;
            b0: number;
            b1: number;
            b2: number;
            type?: string;
        };
        BiquadsRequest: {
            filters: components["schemas"]["FilterSpec"][];
            limits?: components["schemas"]["Limits"];
            response?: components["schemas"]["ResponseGrid"];
            sampleRateHz?: components["schemas"]["SampleRateHz"];
        };
        BiquadsResult: {
            cautions: components["schemas"]["Caution"][];
            response?: components["schemas"]["FrequencyResponse"];
            sampleRateHz: number;
            sections: components["schemas"]["BiquadSection"][];
            warnings: components["schemas"]["Warning"][];
        };
        CalibratorReading: {
            analysedS: number;
            /** @description Everything recorded, dBFS (raw RMS). */
            broadbandRmsDbfs: number;
            calibratorLevelDb: number;
            /** @description The strongest tone found, Hz. */
            measuredFrequencyHz: number;
            /** @description The tone in the 1 kHz octave band, dBFS (raw RMS). */
            rmsDbfs: number;
            /** @description dB SPL = dBFS + splOffsetDb. */
            splOffsetDb: number;
            warnings: components["schemas"]["Warning"][];
        };
        CalibratorUpload: {
            /**
             * @description The calibrator's level, dB SPL.
             * @enum {number}
             */
            calibratorLevelDb: 94 | 114;
            /** @description 0-based channel holding the microphone; required when the file has more than one channel. */
            channel?: number;
            /** @description The recording (at most 20 MiB and 30 s). */
            file: string;
            /** @description The input and gain setting the offset holds for. */
            inputGain?: string;
        };
        Caution: {
            /** @example testSignalLevel */
            code: string;
            message: string;
        };
        /** @description ITU-R BS.2051 label such as `M+030`, `M-110`, `U+045`, `LFE1`, or another identifier of the feed. */
        ChannelLabel: string;
        ChannelSources: {
            delay: {
                measurementIds: components["schemas"]["SourceIds"];
                micPosition: string | null;
                /** @enum {unknown} */
                source: "measuredArrival" | "geometry";
                timingReference: boolean | null;
            };
            level: {
                measurementIds: components["schemas"]["SourceIds"];
                micPosition: string | null;
                /** @enum {unknown} */
                source: "splReading" | "none";
                weighting: string | null;
            };
            response: {
                /** @enum {unknown} */
                kind: "frequencyResponse" | "impulseResponse" | null;
                measurementIds: components["schemas"]["SourceIds"];
                micPositions: string[];
                /** @enum {unknown} */
                source: "responseAverage" | "none";
            };
        };
        CreatedApiKey: components["schemas"]["ApiKey"] & {
            /** @description The clear key, `iso_live_` or `iso_test_` and 43 characters. Shown only in this answer. */
            secret: string;
        };
        CreateKeyRequest: {
            /**
             * Format: date-time
             * @description When the key stops working (RFC 3339); in the future.
             */
            expiresAt?: string;
            /**
             * @description `test` makes an `iso_test_` key.
             * @default live
             * @enum {string}
             */
            kind?: "live" | "test";
            name: components["schemas"]["KeyName"];
            /** @description Whose key it is; the caller when absent. Someone else needs `keys:all`. */
            ownerId?: components["schemas"]["KeyOwnerId"];
            rateLimitPerMinute?: components["schemas"]["KeyRateLimit"];
            role: components["schemas"]["KeyRole"];
        };
        /** @enum {string} */
        CrossoverFamily: "linkwitzRiley" | "butterworth";
        CrossoverRequest: {
            family: components["schemas"]["CrossoverFamily"];
            /** @description Crossover frequency; below sampleRateHz/2. */
            frequencyHz: number;
            /** @description 1–8 for Butterworth; 2, 4 or 8 for Linkwitz-Riley. */
            order: number;
            response?: components["schemas"]["ResponseGrid"];
            sampleRateHz?: components["schemas"]["SampleRateHz"];
        };
        CrossoverResult: {
            family: components["schemas"]["CrossoverFamily"];
            frequencyHz: number;
            highPass: components["schemas"]["SectionCascade"];
            /** @enum {string} */
            highPassPolarity: "normal" | "inverted";
            lowPass: components["schemas"]["SectionCascade"];
            order: number;
            response?: {
                frequenciesHz: number[];
                highPass: components["schemas"]["OutputResponse"];
                lowPass: components["schemas"]["OutputResponse"];
                sum: components["schemas"]["OutputResponse"];
            };
            sampleRateHz: number;
            warnings: components["schemas"]["Warning"][];
        };
        /**
         * @description Decay over frequency: `levelDb[slice][bin]` in dB re the plot's largest value (0 dB at its top, −150 dB
         *     floor), at `timesMs` after the arrival (a waterfall slice's start, a spectrogram window's centre) and
         *     `frequenciesHz` (log-spaced; each the power average over its share of the axis, `binWidthOctaves`
         *     wide). `window` names how each slice was windowed; `resolutionHz` is the finest detail it can show.
         */
        DecayPlot: {
            binWidthOctaves: number;
            frequenciesHz: number[];
            levelDb: number[][];
            resolutionHz: number;
            timesMs: number[];
            window: {
                lengthMs: number;
                name: string;
                taperMs: number;
            };
        };
        DecayTimes: {
            /** @description Early decay time, s (0 to −10 dB, ×6). */
            edtS: number | null;
            /** @description T20, s (−5 to −25 dB, ×3). */
            t20S: number | null;
            /** @description T30, s (−5 to −35 dB, ×2). */
            t30S: number | null;
        };
        DelayChannel: {
            /** @description Measured arrival time at the listening position, in ms. */
            arrivalMs?: number;
            distance?: components["schemas"]["Distance"];
            id: components["schemas"]["ChannelLabel"];
        };
        DelaysRequest: {
            /** @description Each channel `id` (its BS.2051 label) must be unique. Each channel gives exactly one of `distance` or `arrivalMs`. */
            channels: components["schemas"]["DelayChannel"][];
            limits?: components["schemas"]["Limits"];
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            /** @description Speed of sound in m/s, instead of `temperatureC`. */
            speedOfSoundMps?: number;
            /** @description Air temperature in °C; 20 when neither this nor `speedOfSoundMps` is given. */
            temperatureC?: number;
        };
        DelaysResult: {
            channels: {
                arrivalMs: number;
                clamped: boolean;
                /** @description Exact delay to apply */
                delayMs: number;
                delaySamples: number;
                /** @description Present when the channel gave a distance. */
                distanceM?: number;
                id: string;
                /** @description `delaySamples` as time minus `delayMs`, in µs. */
                quantizationErrorUs: number;
            }[];
            /** @description The latest arrival; its delay is 0. */
            referenceChannel: string;
            sampleRateHz: number;
            speedOfSoundMps: number;
            warnings: components["schemas"]["Warning"][];
        };
        /** @description One dependency of the service as readiness found it. */
        DependencyState: {
            /** @enum {string} */
            engine: "sqlite" | "postgresql" | "redis";
            /** @enum {string} */
            name: "database" | "redis";
            /** @enum {string} */
            status: "up" | "down";
        };
        /** @description Metres as a number, or a string with a length unit (`"3.2 m"`, `"10.5 ft"`, `"126 in"`, `"320 cm"`). */
        Distance: number | string;
        EqBandExplanation: {
            /** @description How far the feature stands above (+) or below (−) the target. */
            aboveTargetDb: number;
            /** @enum {string} */
            feature: "peak" | "dip" | "broadExcess" | "broadDeficit";
            featureHz: number;
            frequencyHz: number;
            gainDb: number;
            message: string;
            q: number;
        };
        /** @description Largest boost and largest cut (both ≥ 0) of all bands together at any frequency, dB. */
        EqCombined: {
            maxBoostDb: number;
            maxCutDb: number;
        };
        EqFitPosition: {
            /** @description Microphone position, e.g. MLP or 2. */
            label: string;
            measured: components["schemas"]["MagnitudeResponse"];
        };
        /** @description Give `measured` (one microphone position) or `positions` (several). */
        EqFitRequest: {
            aboveTransition?: components["schemas"]["AboveTransition"];
            /** @description Centre frequencies the processor's bands accept. */
            bandFrequencyRangeHz?: {
                fromHz: number;
                toHz: number;
            };
            bandSteps?: components["schemas"]["BandSteps"];
            /** @description Filter types the processor offers; without `peaking` no band is fitted. */
            filterTypes?: components["schemas"]["FilterType"][];
            /** @description Lower end of the correction. */
            fromHz?: number;
            /** @description Band over which the target is matched to the measurement's level (default 500..2000 Hz). */
            levelReferenceHz?: {
                fromHz: number;
                toHz: number;
            };
            /** @description Most peaking bands to use in all. */
            maxBands: number;
            /**
             * @description Largest boost of all bands together at any frequency; 0 = cuts only.
             * @default 0
             */
            maxBoostDb?: number;
            /**
             * @description Largest cut of all bands together at any frequency.
             * @default 12
             */
            maxCutDb?: number;
            measured?: components["schemas"]["MagnitudeResponse"];
            /**
             * @description Smallest gain worth a band.
             * @default 0.5
             */
            minGainDb?: number;
            /** @description The same loudspeaker measured at several microphone positions. */
            positions?: components["schemas"]["EqFitPosition"][];
            /** @description Allowed Q of the bands below the transition (default 0.5..10). */
            qRange?: {
                max: number;
                min: number;
            };
            room?: components["schemas"]["EqFitRoom"];
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            target?: components["schemas"]["TargetCurve"];
            /** @description Upper end of the correction (default: the transition frequency of `room`, else 200 Hz). */
            toHz?: number;
        };
        EqFitResult: {
            /** @description With positions, their power average on the 1/48-octave grid; otherwise null. */
            average: components["schemas"]["ResponseCurve"] | null;
            bands: components["schemas"]["PeakingBand"][];
            cautions: components["schemas"]["Caution"][];
            combined: components["schemas"]["EqCombined"];
            explanation: {
                bands: components["schemas"]["EqBandExplanation"][];
                notUsed: components["schemas"]["EqNotUsed"][];
                octaveBands: {
                    afterDb: number;
                    beforeDb: number;
                    /** @description Nominal mid-band frequency (IEC 61260-1 octave band). */
                    centreHz: number;
                }[];
            };
            fromHz: number;
            levelReference: {
                fromHz: number;
                /** @enum {string} */
                source: "referenceBand" | "fitBandMedian";
                toHz: number;
            };
            positions: {
                label: string;
                predicted: components["schemas"]["ResponseCurve"];
                residualRmsDb: {
                    after: number;
                    before: number;
                };
            }[];
            /** @description The measurement (with positions, their spatial average on the fit grid) with the sections applied. */
            predicted: components["schemas"]["ResponseCurve"];
            /** @description RMS of (response − target − level) before and after, dB, weighted by agreement between positions: over fromHz..toHz, or up to the top of the broad corrections when aboveTransition was given. */
            residualRmsDb: {
                after: number;
                before: number;
            };
            sampleRateHz: number;
            sections: components["schemas"]["BiquadSection"][];
            /** @description Level at which the corrected response matches the target, dB. */
            targetOffsetDb: number;
            /** @description Upper end of the correction below the transition. */
            toHz: number;
            transition: {
                frequencyHz: number;
                reverberationTimeS: number | null;
                /** @enum {string} */
                source: "room" | "toHz" | "assumed";
            };
            warnings: components["schemas"]["Warning"][];
        };
        /** @description The room, for the transition frequency 2000·√(T/V) (Kuttruff, Room Acoustics). */
        EqFitRoom: {
            /** @description Measured T20/T30; 0.3 s assumed when absent. */
            reverberationTimeS?: number;
            volumeM3: number;
        };
        EqNotUsed: {
            /** @enum {string} */
            code: "null" | "positionsDisagree" | "narrowDip" | "boostsNotAllowed" | "belowMinimumGain" | "merged" | "opposesCut" | "madeResidualWorse" | "littleBenefit" | "bandBudget" | "aboveTransition" | "peakingNotSupported";
            frequencyHz: number | null;
            message: string;
        };
        ExportedCrossover: {
            family: components["schemas"]["CrossoverFamily"];
            frequencyHz: number;
            order: number;
            /** @description Each section's coefficients in the order of `coefficientLayout.order`. */
            sections: number[][];
        };
        FilterPath: {
            family: components["schemas"]["CrossoverFamily"];
            frequencyHz: number;
            order: number;
            sections: components["schemas"]["BiquadSection"][];
        };
        FilterSpec: {
            bandwidthOctaves?: number;
            /** @description Centre, corner or shelf midpoint in Hz; must also be below sampleRateHz/2. */
            frequencyHz: number;
            /** @description Required by peaking and shelves. */
            gainDb?: number;
            q?: number;
            shelfSlope?: number;
            type: components["schemas"]["FilterType"];
        };
        /** @enum {string} */
        FilterType: "peaking" | "lowShelf" | "highShelf" | "lowPass" | "highPass" | "bandPass" | "notch" | "allPass";
        FrequencyResponse: {
            frequenciesHz: number[];
            groupDelayMs?: number[];
            magnitudeDb: number[];
            phaseDeg: number[];
        };
        GeometryRequest: {
            /** @default 2 */
            angleToleranceDeg?: number;
            /** @description Layout id, name or alias (`7.1.4`, `4+7+0`, `bs2051-j`). */
            layout?: string;
            listener: components["schemas"]["RoomPoint"];
            room: components["schemas"]["RoomDimensions"];
            speakers: {
                id: components["schemas"]["ChannelLabel"];
                x: number;
                y: number;
                z: number;
            }[];
        };
        GeometryResult: {
            angleToleranceDeg: number;
            layout: {
                id: string;
                name: string;
                title: string;
            } | null;
            speakers: components["schemas"]["SpeakerGeometry"][];
            warnings: components["schemas"]["Warning"][];
        };
        /** @description The harmonic distortion a recorded sweep shows, per harmonic. */
        HarmonicDistortion: {
            harmonics: {
                advanceS: number;
                frequenciesHz: number[];
                harmonic: number;
                levelDb: number[];
                percent: number[];
            }[];
            smoothingOctaves: number;
        };
        /** @description The analysis of an uploaded impulse response, with the file's details. */
        ImpulseResponseAnalysis: components["schemas"]["AnalysedImpulseResponse"] & {
            file: {
                channelCount: number;
                channelIndex: number;
                durationS: number;
                /** @enum {unknown} */
                encoding: "pcm16" | "pcm24" | "pcm32" | "float32";
                sampleRateHz: number;
                sizeBytes: number;
            };
        };
        ImpulseResponseUpload: {
            /** @description 0-based channel to analyse; required when the file has more than one channel. */
            channel?: number;
            /**
             * @description Frequency points, log-spaced.
             * @default 96
             */
            decayBins?: number;
            /**
             * @description Lowest plotted frequency, Hz.
             * @default 20
             */
            decayFromHz?: number;
            /**
             * @description Time slices of the plots.
             * @default 32
             */
            decaySlices?: number;
            /**
             * @description Arrival to the last slice, ms.
             * @default 300
             */
            decaySpanMs?: number;
            /**
             * @description Highest plotted frequency, Hz (at most Nyquist).
             * @default 20000
             */
            decayToHz?: number;
            /** @description The WAV file (at most 20 MiB and 30 s). */
            file: string;
            /** @description One of your microphones (`POST /v1/microphones`) — its calibration is subtracted from the response and, with its offset, the response is also given in dB SPL. */
            microphoneId?: components["schemas"]["MicrophoneId"];
            /** @description Inside height (z), metres. */
            roomHeightM?: number;
            /** @description Inside length (y), metres. */
            roomLengthM?: number;
            /** @description Inside width (x), metres. */
            roomWidthM?: number;
            /**
             * @description Smoothing window in octaves, 1/48 (0.0208) to 1; default 1/12. Values below 1/48 count as 1/48.
             * @default 0.08333333333333333
             */
            smoothingOctaves?: number;
            /**
             * @description Also answer a spectrogram: short-time spectra through a Hann window of `spectrogramWindowMs`,
             *     centred from the arrival to `decaySpanMs` after it.
             * @default false
             */
            spectrogram?: boolean;
            /**
             * @description Spectrogram window length, ms.
             * @default 50
             */
            spectrogramWindowMs?: number;
            /**
             * @description Air temperature for the modes.
             * @default 20
             */
            temperatureC?: number;
            /**
             * @description Also answer a cumulative spectral decay (`waterfall`): the spectrum of what is left of the response
             *     from each slice's start to a fixed end `waterfallWindowMs` after the arrival, each slice starting
             *     `decaySpanMs/(decaySlices − 1)` later (Berman & Fincham, JAES 25(6), 1977); rectangular start,
             *     half-Hann end over the window's last fifth.
             * @default false
             */
            waterfall?: boolean;
            /**
             * @description Fixed end of the waterfall after the arrival, ms (longer than decaySpanMs).
             * @default 500
             */
            waterfallWindowMs?: number;
        };
        IntegrationCandidate: {
            /** @description Deepest point below the mean (worst main). */
            deepestDipDb: number;
            delayMs: number;
            delaySamples: number;
            /** @description RMS deviation of the sum from its mean over the band. */
            deviationDb: number;
            /** @description Mean level of the sum over the band. */
            meanDb: number;
            /** @enum {unknown} */
            polarity: "normal" | "inverted";
            /** @description meanDb − deviationDb; the highest wins. */
            scoreDb: number;
            /** @description Mean of 20·log10(|sub + main| / (|sub| + |main|)): 0 dB when they add in phase. */
            summationDb: number;
        };
        /** @description A key's `id` (not its secret). */
        KeyId: string;
        /** @description A label for people; stored exactly as given. Control characters are refused. */
        KeyName: string;
        /** @description A user's id. */
        KeyOwnerId: string;
        /** @description Requests per minute this key may make; the server default applies when absent or null. */
        KeyRateLimit: number;
        /**
         * @description `calculate`: stateless calculations only. `tuning`: also rooms, tunings and measurements of the key's
         *     owner. `admin`: also keys, usage and users of everyone.
         * @enum {string}
         */
        KeyRole: "calculate" | "tuning" | "admin";
        Layout: {
            aliases: string[];
            channels: components["schemas"]["LayoutChannel"][];
            /** @example bs2051-j */
            id: string;
            /**
             * @description Upper+Middle+Bottom loudspeaker count, LFE not counted.
             * @example 4+7+0
             */
            name: string;
            notes: string[];
            reference: string;
            rules: {
                sideSurroundSpacingDeg: components["schemas"]["AngleRange"] | null;
                symmetryAboveAzimuthDeg: number;
                symmetryToleranceDeg: number;
            };
            /** @description BS.2051 system letter; null for 9.1.6. */
            system: string | null;
            title: string;
        };
        LayoutChannel: {
            /** @description Nominal azimuth */
            azimuthDeg: number | null;
            /** @description Permitted azimuth intervals (two only for the screen loudspeakers of system G). */
            azimuthRangesDeg: components["schemas"]["AngleRange"][] | null;
            /** @description Nominal elevation, positive up. */
            elevationDeg: number | null;
            elevationRangeDeg: components["schemas"]["AngleRange"] | null;
            isLfe: boolean;
            label: components["schemas"]["ChannelLabel"];
            /** @enum {string} */
            layer: "middle" | "upper" | "upperHigh" | "top" | "bottom" | "lfe";
            note?: string;
        };
        LevelChannel: {
            distance?: components["schemas"]["Distance"];
            id: components["schemas"]["ChannelLabel"];
            measuredDb?: number;
            /** @description This channel's target relative to the others, in dB (e.g. +10 for LFE in band). */
            targetOffsetDb?: number;
        };
        LevelsRequest: {
            /** @description Each channel `id` (its BS.2051 label) must be unique. Each channel gives exactly one of `measuredDb` or `distance`. */
            channels: components["schemas"]["LevelChannel"][];
            /** @description Level each loudspeaker gives at 1 m, for channels given by distance. */
            levelAt1mDb?: number;
            limits?: components["schemas"]["Limits"];
            /** @description Level every channel should reach, in dB. Absent → align to the quietest channel. */
            targetDb?: number;
        };
        LevelsResult: {
            /** @enum {string} */
            alignedTo: "target" | "quietestChannel";
            cautions: components["schemas"]["Caution"][];
            channels: {
                clamped: boolean;
                distanceM?: number;
                estimated: boolean;
                expectedDb: number;
                id: string;
                /** @description Measured */
                levelDb: number;
                trimDb: number;
            }[];
            /** @description The reference level used: the target, or the quietest channel. */
            targetDb: number;
            warnings: components["schemas"]["Warning"][];
        };
        /**
         * @description What the target processor can do. Typical trade hardware allows 0–75 ms of delay, ±12 dB of trim and
         *     eight parametric bands per output (common practice); these are examples, not defaults.
         * @example {
         *       "delayMaxMs": 75,
         *       "trimMinDb": -12,
         *       "trimMaxDb": 12,
         *       "eqBandsPerChannel": 8
         *     }
         */
        Limits: {
            delayMaxMs?: number;
            eqBandsPerChannel?: number;
            eqMaxBoostDb?: number;
            eqMaxCutDb?: number;
            /** @description Highest frequency of any filter (EQ band or crossover). */
            frequencyMaxHz?: number;
            /** @description Lowest frequency of any filter (EQ band or crossover). */
            frequencyMinHz?: number;
            trimMaxDb?: number;
            trimMinDb?: number;
        };
        ListMeta: {
            hasMore: boolean;
        };
        /** @description Arrivals counted from the loopback (timing reference) channel of a recorded sweep. */
        LoopbackTiming: {
            arrivalFromReferenceMs: number;
            arrivalFromReferenceSamples: number;
            peakFromReferenceMs: number;
            peakFromReferenceSamples: number;
            referenceArrivalMs: number;
            referenceArrivalSample: number;
            referencePeakSample: number;
        };
        /** @description A magnitude response; frequencies ascending, one level per frequency. */
        MagnitudeResponse: {
            frequenciesHz: number[];
            magnitudeDb: number[];
        };
        /**
         * @description The `result` of a frequency-response measurement: the response as uploaded (frequencies ascending)
         *     and, with a microphone, corrected by its calibration.
         */
        MeasuredFrequencyResponse: {
            frequenciesHz: number[];
            magnitudeDb: number[];
            microphone?: components["schemas"]["MicrophoneCorrection"];
            phaseDeg?: number[];
            warnings?: components["schemas"]["Warning"][];
        };
        /**
         * @description The `result` of an impulse-response measurement: its analysis and, from a recorded sweep, the
         *     deconvolution and distortion; with a timing reference, that reference's arrival.
         */
        MeasuredImpulseResponse: components["schemas"]["AnalysedImpulseResponse"] & {
            deconvolution?: components["schemas"]["SweepDeconvolution"];
            distortion?: components["schemas"]["HarmonicDistortion"];
            timing?: components["schemas"]["LoopbackTiming"];
            /**
             * @description The timing reference's arrival: detected in the loopback channel `fileChannel` of the file
             *     (`loopback`), or as the capture tool gave it (`given`, `timingReferenceMs`). Plans count the
             *     loudspeaker's arrival from it.
             */
            timingReference?: {
                arrivalMs: number;
                fileChannel?: number;
                /** @enum {unknown} */
                source: "loopback" | "given";
            };
        };
        /** @description The `result` of an SPL reading. */
        MeasuredSplReading: {
            /** @description dB re 20 µPa. */
            splDb: number;
            /** @enum {unknown} */
            timeWeighting: "slow" | "fast";
            /** @enum {unknown} */
            weighting: "A" | "C" | "Z";
        };
        /** @description The version of `tuningId` that was loaded (default its latest); needs `tuningId`. */
        MeasuredTuningVersion: number;
        Measurement: {
            channel: string;
            /** Format: date-time */
            createdAt: string;
            id: string;
            /** @enum {unknown} */
            kind: "impulseResponse" | "frequencyResponse" | "spl";
            micPosition: string;
            name: string | null;
            notes: string | null;
            /**
             * @description Impulse response: the analysis of `POST /v1/analysis/impulse-response` (without `file`); from a
             *     recorded sweep, that of `POST /v1/analysis/sweep` (with `deconvolution`, `distortion`, and with a
             *     loopback `timing` and `timingReference`); with `waterfall`/`spectrogram` asked for at upload, those
             *     decay plots too (up to 128 × 256 levels each). Frequency
             *     response: `frequenciesHz`, `magnitudeDb` and, when given, `phaseDeg`. SPL: `splDb`, `weighting`,
             *     `timeWeighting`. Which one follows `kind`. Left out of lists.
             */
            result?: components["schemas"]["MeasuredImpulseResponse"] | components["schemas"]["MeasuredFrequencyResponse"] | components["schemas"]["MeasuredSplReading"];
            roomId: string;
            /** @description What was uploaded (the audio itself is not kept). */
            source: {
                channelCount?: number;
                channelIndex?: number;
                durationS?: number;
                encoding?: string;
                /**
                 * @description Set when the file was a recorded sweep.
                 * @constant
                 */
                fileKind?: "sweepRecording";
                fileName?: string;
                sampleRateHz?: number;
                sizeBytes?: number;
                /** @description The sweep that was played and the part of the file analysed (a recorded sweep only). */
                sweep?: {
                    durationS: number;
                    endHz: number;
                    fadeInS: number;
                    fadeOutS: number;
                    lengthS?: number;
                    levelDbfs: number;
                    /** @enum {unknown} */
                    method: "regularizedDivision" | "inverseFilter";
                    offsetS: number;
                    startHz: number;
                };
                /** @enum {unknown} */
                type: "wav" | "text" | "json";
            };
            /** @enum {unknown} */
            stage: "before" | "after";
            /** @description A few numbers for lists: arrival (and, with a timing reference, arrivalFromReferenceMs), level and decay times; points and range; or the SPL. */
            summary: {
                /** @description Impulse response with a timing reference: arrival counted from it, ms. */
                arrivalFromReferenceMs?: number;
                /** @description Impulse response: arrival, ms. */
                arrivalMs?: number;
                /** @description Impulse response: early decay time. */
                edtS?: number | null;
                /** @description Impulse response: energy. */
                energyDb?: number;
                /** @description Frequency response: lowest frequency. */
                fromHz?: number;
                /** @description Impulse response: peak level. */
                peakDbfs?: number;
                /** @description Frequency response: number of points. */
                points?: number;
                /** @description SPL reading, dB re 20 µPa. */
                splDb?: number;
                /** @description Impulse response: T20. */
                t20S?: number | null;
                /** @description Impulse response: T30. */
                t30S?: number | null;
                /** @description Frequency response: highest frequency. */
                toHz?: number;
                /**
                 * @description SPL reading: frequency weighting.
                 * @enum {unknown}
                 */
                weighting?: "A" | "C" | "Z";
            };
            tuningId: string | null;
            tuningVersion: number | null;
        };
        /** @description A frequency response (arrays or text) or an SPL reading, for one channel at one microphone position. */
        MeasurementCreate: {
            channel: components["schemas"]["ChannelLabel"];
            /** @constant */
            kind: "frequencyResponse";
            micPosition?: string;
            /** @description One of your microphones; its calibration is subtracted from the response. */
            microphoneId?: components["schemas"]["MicrophoneId"];
            name?: string;
            notes?: string;
            response?: {
                frequenciesHz: number[];
                magnitudeDb: number[];
                phaseDeg?: number[];
            };
            stage?: components["schemas"]["MeasurementStage"];
            /** @description The response as text columns. */
            text?: string;
            tuningId?: components["schemas"]["TuningId"];
            tuningVersion?: components["schemas"]["MeasuredTuningVersion"];
        } | {
            channel: components["schemas"]["ChannelLabel"];
            /** @constant */
            kind: "spl";
            micPosition?: string;
            name?: string;
            notes?: string;
            /** @description Sound pressure level, dB re 20 µPa. */
            splDb: number;
            stage?: components["schemas"]["MeasurementStage"];
            /**
             * @description Time weighting; default slow.
             * @enum {unknown}
             */
            timeWeighting?: "slow" | "fast";
            tuningId?: components["schemas"]["TuningId"];
            tuningVersion?: components["schemas"]["MeasuredTuningVersion"];
            /**
             * @description Frequency weighting; default C.
             * @enum {unknown}
             */
            weighting?: "A" | "C" | "Z";
        };
        MeasurementId: string;
        /**
         * @description `before`: taken without a tuning (or before one was loaded) — plans use it. `after`: taken with the
         *     tuning version `tuningId`/`tuningVersion` loaded in the processor — verification uses it and plans
         *     leave it out. Default `after` when `tuningId` is given, else `before`; `after` needs `tuningId`.
         * @enum {unknown}
         */
        MeasurementStage: "before" | "after";
        MeasurementUpload: {
            /** @description Loudspeaker id in the room, e.g. M+030. */
            channel: string;
            /** @description Frequency points, log-spaced (default 96). */
            decayBins?: number;
            /** @description Lowest plotted frequency, Hz (default 20). */
            decayFromHz?: number;
            /** @description Time slices of the plots (default 32). */
            decaySlices?: number;
            /** @description Arrival to the last slice, ms (default 300). */
            decaySpanMs?: number;
            /** @description Highest plotted frequency, Hz (default 20000, at most Nyquist). */
            decayToHz?: number;
            /** @description Sweep T, fades included, s (sweepRecording; default 10). */
            durationS?: number;
            /** @description Sweep f2, Hz (sweepRecording; default 20000). */
            endHz?: number;
            /** @description Sweep fade-in, s (sweepRecording; default 0.05). */
            fadeInS?: number;
            /** @description Sweep fade-out, s (sweepRecording; default 0.01). */
            fadeOutS?: number;
            /** @description A WAV impulse response (at most 20 MiB and 30 s) or a text frequency response. */
            file: string;
            /** @description 0-based channel of a multichannel WAV file. */
            fileChannel?: number;
            /**
             * @description What `file` holds. Default: a WAV file is an impulse response, anything else a text frequency
             *     response. `sweepRecording`: the recording of an exponential sweep, deconvolved on arrival with the
             *     sweep's parameters below.
             * @enum {unknown}
             */
            fileKind?: "impulseResponse" | "sweepRecording" | "frequencyResponse";
            /** @description Length of the part analysed, s — a sequence's periodS (sweepRecording; default to the end of the file). */
            lengthS?: number;
            /** @description Sweep sine peak as played, dBFS (sweepRecording; default −12). */
            levelDbfs?: number;
            /**
             * @description Deconvolution (sweepRecording; default regularizedDivision), as in `POST /v1/analysis/sweep`.
             * @enum {unknown}
             */
            method?: "regularizedDivision" | "inverseFilter";
            /** @default 1 */
            micPosition?: string;
            /** @description One of your microphones (`POST /v1/microphones`) — its calibration is subtracted from the response and, with its offset, the response is also given in dB SPL. */
            microphoneId?: components["schemas"]["MicrophoneId"];
            name?: string;
            notes?: string;
            /** @description Start of the part analysed, s into the file — a sequence slot's startS (sweepRecording; default 0). */
            offsetS?: number;
            /**
             * @description 0-based channel of the same WAV file that holds the timing reference (an electrical loopback of
             *     the test signal). Its arrival is stored as `result.timingReference`, and plans then use the
             *     loudspeaker's arrival relative to it, so converter and interface latency cancel.
             */
            referenceFileChannel?: number;
            /** @default 0.08333333333333333 */
            smoothingOctaves?: number;
            /** @description Also store a spectrogram (`result.spectrogram`), as the analysis routes answer it. Default false. */
            spectrogram?: boolean;
            /** @description Spectrogram window length, ms (default 50). */
            spectrogramWindowMs?: number;
            stage?: components["schemas"]["MeasurementStage"];
            /** @description Sweep f1, Hz (sweepRecording; default 20). */
            startHz?: number;
            /**
             * @description Air temperature for the modes.
             * @default 20
             */
            temperatureC?: number;
            /** @description The timing reference's arrival in this file, ms, when the capture tool measured it itself. */
            timingReferenceMs?: number;
            tuningId?: components["schemas"]["TuningId"];
            tuningVersion?: components["schemas"]["MeasuredTuningVersion"];
            /**
             * @description Also store a cumulative spectral decay (`result.waterfall`) of a WAV impulse response or recorded
             *     sweep, as `POST /v1/analysis/impulse-response` answers it. The audio is not kept, so decay plots
             *     can only be asked for with the upload. Default false.
             */
            waterfall?: boolean;
            /** @description Fixed end of the waterfall after the arrival, ms (default 500; longer than decaySpanMs). */
            waterfallWindowMs?: number;
        };
        Microphone: {
            /** @description The parsed calibration (the microphone's deviation, subtracted from measured responses), or null. */
            calibration: null | {
                fileName: string | null;
                frequenciesHz: number[];
                fromHz: number;
                magnitudeDb: number[];
                phaseDeg?: number[];
                points: number;
                toHz: number;
            };
            /** Format: date-time */
            createdAt: string;
            id: components["schemas"]["MicrophoneId"];
            name: string;
            notes: string | null;
            sensitivity: null | components["schemas"]["MicrophoneSensitivity"];
            serial: string | null;
            /** @description dB SPL = dBFS + offsetDb, from the sensitivity in dBFS or a calibrator recording; null when neither. */
            splOffset: null | {
                calibratorLevelDb?: number;
                inputGain?: string | null;
                /** Format: date-time */
                measuredAt?: string;
                measuredFrequencyHz?: number;
                offsetDb: number;
                rmsDbfs?: number;
                /** @enum {unknown} */
                source: "sensitivity" | "calibrator";
            };
            /** Format: date-time */
            updatedAt: string;
        };
        /** @description The microphone named by the request and what was done with it. */
        MicrophoneCorrection: {
            calibratedFromHz?: number;
            calibratedToHz?: number;
            /** @description The calibration was subtracted from the response (false without a calibration). */
            correctionApplied: boolean;
            /** @description Above this the last value was used. */
            heldFlatAboveHz?: number | null;
            /** @description Below this the first value was used (response points outside the calibration). */
            heldFlatBelowHz?: number | null;
            id: components["schemas"]["MicrophoneId"];
            name: string;
            phaseCorrected?: boolean;
            serial: string | null;
            /** @description dB SPL = dBFS + this, when the microphone has an offset. */
            splOffsetDb: number | null;
        };
        MicrophoneCreate: {
            calibrationFileName?: string;
            /** @description The calibration file as text. */
            calibrationText?: string;
            name: string;
            notes?: string;
            sensitivity?: components["schemas"]["MicrophoneSensitivity"];
            serial?: string;
        };
        /** @description A microphone id, as `POST /v1/microphones` answers it. */
        MicrophoneId: string;
        /** @description The data sheet's sensitivity, one of the two. */
        MicrophoneSensitivity: {
            /** @description RMS level read at 94 dB SPL, dBFS (raw RMS). */
            dbfsAt94DbSpl?: number;
            /** @description Output at 1 Pa (94 dB SPL), mV. */
            mvPerPa?: number;
        };
        MicrophoneUpdate: {
            calibrationFileName?: string | null;
            calibrationText?: string | null;
            name?: string;
            notes?: string | null;
            sensitivity?: components["schemas"]["MicrophoneSensitivity"] | null;
            serial?: string | null;
        };
        OutboxMessage: {
            id: string;
            /** Format: date-time */
            sentAt: string;
            subject: string;
            text: string;
            to: string;
        };
        OutputResponse: {
            groupDelayMs: number[];
            magnitudeDb: number[];
            phaseDeg: number[];
        };
        PeakingBand: {
            frequencyHz: number;
            gainDb: number;
            q: number;
            /** @constant */
            type: "peaking";
        };
        PlanChannel: {
            arrivalMs: number;
            delayMs: number;
            delaySamples: number;
            distanceM: number | null;
            eq: {
                bands: components["schemas"]["PeakingBand"][];
                combined?: components["schemas"]["EqCombined"] | null;
                explanation?: {
                    bands: components["schemas"]["EqBandExplanation"][];
                    notUsed: components["schemas"]["EqNotUsed"][];
                } | null;
                fromHz: number | null;
                predicted: {
                    frequenciesHz: number[];
                    magnitudeDb: number[];
                } | null;
                residualRmsDb: {
                    after: number;
                    before: number;
                } | null;
                sections: components["schemas"]["BiquadSection"][];
                toHz: number | null;
            };
            expectedDb: number | null;
            highPass: components["schemas"]["PlanHighPass"] | null;
            id: string;
            /** @enum {string} */
            polarity: "normal" | "inverted";
            quantizationErrorUs: number;
            /** @enum {string} */
            role: "managed" | "fullRange" | "lfe";
            trimDb: number;
        };
        PlanChannelInput: {
            /** @description Measured arrival; preferred over position and distance for the delay. */
            arrivalMs?: number;
            /** @default false */
            bassManaged?: boolean;
            distance?: components["schemas"]["Distance"];
            id: components["schemas"]["ChannelLabel"];
            /** @description SPL reading of the reference test signal at the listening position. */
            measuredDb?: number;
            measuredResponse?: components["schemas"]["MagnitudeResponse"];
            position?: components["schemas"]["RoomPoint"];
            /** @description Level relative to the reference; default +10 for LFE channels, 0 otherwise. */
            targetOffsetDb?: number;
        };
        PlanHighPass: {
            family: components["schemas"]["CrossoverFamily"];
            frequencyHz: number;
            order: number;
            /** @enum {string} */
            polarity: "normal" | "inverted";
            sections: components["schemas"]["BiquadSection"][];
        };
        PlanRequest: {
            channels: components["schemas"]["PlanChannelInput"][];
            layout: string;
            limits?: components["schemas"]["Limits"];
            listener?: components["schemas"]["RoomPoint"];
            room?: components["schemas"]["RoomDimensions"];
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            targets?: components["schemas"]["PlanTargets"];
            temperatureC?: number;
        };
        PlanTargets: {
            crossoverFamily?: components["schemas"]["CrossoverFamily"];
            /** @default 80 */
            crossoverHz?: number;
            /** @default 4 */
            crossoverOrder?: number;
            curve?: components["schemas"]["TargetCurve"];
            /**
             * @description Largest EQ boost the fit may use (0: cuts only).
             * @default 0
             */
            eqMaxBoostDb?: number;
            /** @description Upper end of the EQ correction (default: the room transition frequency; 200 Hz without a room). */
            eqToHz?: number;
            /** @default 10 */
            lfeGainDb?: number;
            referenceDb?: number;
            /** @description Reverberation time for the EQ transition frequency 2000·√(T/V) (0.3 s assumed when absent). */
            reverberationTimeS?: number;
        };
        /** @description RFC 9457 problem details. */
        Problem: {
            detail?: string;
            errors?: {
                /** @description For a tuning refused by a limit, the limit itself. */
                limit?: {
                    /**
                     * @example trimMaxDb
                     * @example eqMaxBoostDb
                     * @example delay.max
                     * @example eq.filterTypes
                     */
                    name: string;
                    /** @enum {string} */
                    source: "room" | "profile";
                    value: number | string | (number | string)[];
                };
                message: string;
                /** @description JSON pointer (RFC 6901) to the bad field in the request. */
                pointer: string;
                /**
                 * @description For a tuning refused by its room's limits or processor profile: the setting outside the
                 *     limit, as a JSON pointer into the tuning (`/channels/3/trimDb`, `/channels/0/eq`).
                 */
                setting?: string;
            }[];
            instance?: string;
            requestId?: string;
            status: number;
            title: string;
            /** @description A URI reference that identifies the problem type. */
            type: string;
        };
        ProcessorProfile: {
            coefficients: components["schemas"]["ProfileCoefficients"];
            /** Format: date-time */
            createdAt: string;
            delay: components["schemas"]["ProfileDelay"];
            eq: components["schemas"]["ProfileEq"];
            id: string;
            name: string;
            ownerId: string;
            sampleRatesHz: number[];
            trimDb: components["schemas"]["ProfileTrim"];
            /** Format: date-time */
            updatedAt: string;
        };
        ProcessorProfileSettings: {
            coefficients: components["schemas"]["ProfileCoefficients"];
            delay: components["schemas"]["ProfileDelay"];
            eq: components["schemas"]["ProfileEq"];
            name: string;
            sampleRatesHz: number[];
            trimDb: components["schemas"]["ProfileTrim"];
        };
        /**
         * @description How biquad coefficients are written. `order` lists b0, b1, b2, a1, a2 in the processor's order, and
         *     a0 where the processor wants it written (always 1: sections are normalised). `feedbackSign` `plus`
         *     means the denominator 1 + a1·z⁻¹ + a2·z⁻² (a1, a2 as designed); `minus` means 1 − a1·z⁻¹ − a2·z⁻²,
         *     so a1 and a2 are written negated. `numberFormat` `decimal` rounds to `decimalPlaces`; `float32`
         *     to the nearest IEEE 754 single-precision value.
         */
        ProfileCoefficients: {
            decimalPlaces?: number;
            /** @enum {string} */
            feedbackSign: "plus" | "minus";
            /** @enum {string} */
            numberFormat: "decimal" | "float32";
            order: ("b0" | "b1" | "b2" | "a0" | "a1" | "a2")[];
        };
        /** @description Delay as the processor takes it; `min`, `max` and `step` are in `unit`. */
        ProfileDelay: {
            max: number;
            min: number;
            step: number;
            /** @enum {string} */
            unit: "ms" | "samples";
        };
        ProfileEq: {
            bandsPerChannel: number;
            filterTypes: components["schemas"]["FilterType"][];
            frequencyHz: components["schemas"]["ProfileFrequency"];
            /** @enum {string} */
            frequencyStepUnit: "hz" | "octave";
            gainDb: components["schemas"]["ProfileGain"];
            q: components["schemas"]["ProfileQ"];
        };
        /** @description Hz; `step` is in hertz, or a fraction of an octave when `frequencyStepUnit` is `octave`. */
        ProfileFrequency: {
            max: number;
            min: number;
            step: number;
        };
        ProfileGain: {
            max: number;
            min: number;
            step: number;
        };
        /** @description A processor profile id, as `POST /v1/processor-profiles` answers it. */
        ProfileId: string;
        ProfileQ: {
            max: number;
            min: number;
            step: number;
        };
        ProfileTrim: {
            max: number;
            min: number;
            step: number;
        };
        ResponseCurve: {
            frequenciesHz: number[];
            magnitudeDb: number[];
        };
        /** @description Frequencies at which to evaluate a response, either listed or as a log-spaced sweep. */
        ResponseGrid: {
            frequenciesHz: number[];
        } | {
            fromHz: number;
            /** @description Points per octave; 12 when absent. */
            pointsPerOctave?: number;
            toHz: number;
        };
        Room: {
            /** Format: date-time */
            createdAt: string;
            dimensions: components["schemas"]["RoomDimensions"];
            geometry: {
                angleToleranceDeg: number;
                speakers: components["schemas"]["SpeakerGeometry"][];
                warnings: components["schemas"]["Warning"][];
            };
            /** @example room_0mf3x1c2a9f8a7b6c5d4e */
            id: string;
            /** @description Canonical layout id, e.g. `bs2051-j`. */
            layout: string;
            /** @example 4+7+0 */
            layoutName: string;
            limits: components["schemas"]["Limits"] | null;
            listener: components["schemas"]["RoomPoint"];
            loudspeakers: components["schemas"]["RoomLoudspeaker"][];
            name: string;
            notes: string | null;
            ownerId: string;
            profileId: string | null;
            sampleRateHz: number;
            /** Format: date-time */
            updatedAt: string;
        };
        RoomCreate: {
            dimensions: components["schemas"]["RoomDimensions"];
            /** @description Layout id, name or alias (`7.1.4`). */
            layout: string;
            limits?: components["schemas"]["Limits"];
            listener: components["schemas"]["RoomPoint"];
            loudspeakers: components["schemas"]["RoomLoudspeakers"];
            name: string;
            notes?: string;
            /** @description One of the room owner's processor profiles; tunings are checked against it and exported for it. */
            profileId?: components["schemas"]["ProfileId"] | null;
            sampleRateHz?: components["schemas"]["SampleRateHz"];
        };
        RoomDimensions: {
            /** @description Floor to ceiling, along z. */
            heightM: number;
            /** @description Front wall to back wall, along y. */
            lengthM: number;
            /** @description Front wall to side, along x. */
            widthM: number;
        };
        /** @description A room id, as `POST /v1/rooms` answers it. */
        RoomId: string;
        RoomLoudspeaker: {
            id: components["schemas"]["ChannelLabel"];
            name?: string;
            x: number;
            y: number;
            z: number;
        };
        RoomLoudspeakers: components["schemas"]["RoomLoudspeaker"][];
        RoomPlan: {
            cautions: components["schemas"]["Caution"][];
            channels: components["schemas"]["PlanChannel"][];
            layout: {
                id: string;
                name: string;
                title: string;
            };
            referenceChannel: string;
            referenceDb: number | null;
            sampleRateHz: number;
            speedOfSoundMps: number;
            subwoofer: {
                channel: string | null;
                crossoverPhaseDifferenceDeg: number;
                headroomDb: number;
                lfeGainDb: number;
                lowPass: components["schemas"]["FilterPath"];
                suggestedDelayMs: number;
                suggestedDelaySamples: number;
                /** @enum {string} */
                suggestedPolarity: "normal" | "inverted";
            } | null;
            warnings: components["schemas"]["Warning"][];
        };
        RoomPlanRequest: {
            /** @description Channels handed to the subwoofer; default every channel but the LFE ones when the room has an LFE channel, none otherwise. */
            bassManaged?: components["schemas"]["ChannelLabel"][];
            measurements?: {
                /**
                 * @default auto
                 * @enum {unknown}
                 */
                delaysFrom?: "auto" | "measuredArrival" | "geometry";
                exclude?: components["schemas"]["MeasurementId"][];
                /** @description Use only these measurements ("after" measurements too, when listed). */
                include?: components["schemas"]["MeasurementId"][];
                /** @description Position whose arrivals and SPL readings are used. */
                micPosition?: string;
            };
            /** @description Name of the stored tuning (default "Plan from measurements"). */
            name?: string;
            notes?: string;
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            /**
             * @description Save the plan as a new tuning (version 1).
             * @default false
             */
            store?: boolean;
            targets?: components["schemas"]["PlanTargets"];
            temperatureC?: number;
        };
        /** @description Metres from the floor's front-left corner; x right, y toward the back wall, z up. */
        RoomPoint: {
            x: number;
            y: number;
            z: number;
        };
        RoomUpdate: {
            dimensions?: components["schemas"]["RoomDimensions"];
            layout?: string;
            limits?: components["schemas"]["Limits"];
            listener?: components["schemas"]["RoomPoint"];
            loudspeakers?: components["schemas"]["RoomLoudspeakers"];
            name?: string;
            notes?: string;
            profileId?: components["schemas"]["ProfileId"] | null;
            sampleRateHz?: number;
        };
        /**
         * @description Processor sample rate in hertz.
         * @default 48000
         */
        SampleRateHz: number;
        SectionCascade: {
            sections: components["schemas"]["BiquadSection"][];
        };
        SessionBody: {
            /**
             * @description What the signed-in user may do, from the server's own permission table; the console shows
             *     its pages and controls by these and the server enforces them on every request.
             */
            permissions: ("calculate" | "tuning" | "keys:own" | "keys:all" | "usage:own" | "usage:all" | "users")[];
            user: components["schemas"]["SessionUser"];
        };
        SessionUser: {
            email: string;
            id: string;
            name: string | null;
            /** @enum {string} */
            role: "admin" | "developer" | "viewer";
        };
        SignOff: {
            date: string;
            engineer: string;
            microphone: string;
            notes?: string;
            positions: string[];
            referenceLevelDb: number;
            /** Format: date-time */
            signedAt: string;
            /** @enum {unknown} */
            verdict: "pass" | "warn" | "fail" | "incomplete";
            /** @enum {unknown} */
            weighting: "A" | "C" | "Z";
        };
        SignOffRequest: {
            /**
             * Format: date
             * @description Day of the verification, YYYY-MM-DD.
             */
            date: string;
            engineer: string;
            microphone: string;
            notes?: string;
            positions: string[];
            referenceLevelDb: number;
            /** @enum {unknown} */
            weighting: "A" | "C" | "Z";
        };
        SignOffResult: {
            signOff: components["schemas"]["SignOff"];
            tuningId: string;
            version: number;
        };
        SourceIds: string[];
        SpeakerGeometry: {
            /** @description Positive to the left, in (−180, 180]. */
            azimuthDeg: number;
            /** @description Actual minus nominal; `azimuthDeg` is null for a loudspeaker whose nominal direction is straight up. */
            deviation: {
                /** @description Great-circle angle between actual and nominal direction. */
                angleDeg: number;
                azimuthDeg: number | null;
                elevationDeg: number;
            } | null;
            distanceM: number;
            /** @description Positive upward. */
            elevationDeg: number;
            id: string;
            nominal: {
                azimuthDeg: number;
                elevationDeg: number;
            } | null;
            permitted: {
                azimuthRangesDeg: components["schemas"]["AngleRange"][];
                elevationRangeDeg: components["schemas"]["AngleRange"];
            } | null;
            /** @description Null where there is nothing to check (no layout */
            withinTolerance: boolean | null;
        };
        StepRounding: {
            message: string;
            /** @description What the export gives the processor */
            rounded: number;
            /** @description JSON pointer into the settings: `/channels/2/delayMs`, `/channels/0/eq/1/q`. */
            setting: string;
            /** @enum {string} */
            unit: "ms" | "samples" | "dB" | "Hz" | "";
            /** @description The stored value */
            value: number;
        };
        StoredCrossover: {
            family: components["schemas"]["CrossoverFamily"];
            frequencyHz: number;
            /** @description 1–8 for Butterworth; 2, 4 or 8 for Linkwitz-Riley. */
            order: number;
        };
        StoredRoomPlan: components["schemas"]["RoomPlan"] & {
            channels: (components["schemas"]["PlanChannel"] & {
                sources: components["schemas"]["ChannelSources"];
            })[];
            measurements: {
                ignored: {
                    id: string;
                    reason: string;
                }[];
                referencePosition: string | null;
                used: components["schemas"]["SourceIds"];
            };
            subwoofer: {
                integration: components["schemas"]["SubwooferIntegration"];
            } | null;
            /** @description The stored tuning (only with `store: true`). */
            tuning?: components["schemas"]["Tuning"];
        };
        StoredTargetCurve: {
            /** Format: date-time */
            createdAt: string;
            id: components["schemas"]["TargetCurveId"];
            name: string;
            notes: string | null;
            ownerId: string;
            points: components["schemas"]["TargetPoint"][];
            /** Format: date-time */
            updatedAt: string;
        };
        SubwooferIntegration: {
            band: {
                fromHz: number;
                toHz: number;
            };
            chosen: components["schemas"]["IntegrationCandidate"];
            geometric: {
                delayMs: number;
                delaySamples: number;
                /** @enum {unknown} */
                polarity: "normal" | "inverted";
            };
            mains: string[];
            measurementIds: components["schemas"]["SourceIds"];
            micPosition: string;
            runnersUp: components["schemas"]["IntegrationCandidate"][];
            searchedUpToMs: number;
            /** @constant */
            source: "measuredResponses";
            subGainDb: number;
            summed: {
                channel: string;
                frequenciesHz: number[];
                magnitudeDb: number[];
            }[];
        } | {
            /** @description Always empty. */
            measurementIds: string[];
            reason: string;
            /** @constant */
            source: "geometry";
        };
        /** @description How a recorded sweep was turned into an impulse response. */
        SweepDeconvolution: {
            fftSize: number;
            /** @description Samples of linear response analysed. */
            linearSamples: number;
            /** @enum {unknown} */
            method: "regularizedDivision" | "inverseFilter";
        };
        SweepRecordingAnalysis: components["schemas"]["ImpulseResponseAnalysis"] & {
            deconvolution: components["schemas"]["SweepDeconvolution"];
            distortion: components["schemas"]["HarmonicDistortion"];
            timing?: components["schemas"]["LoopbackTiming"];
        };
        SweepRecordingUpload: {
            /** @description 0-based channel holding the microphone; required when the file has more than one channel. */
            channel?: number;
            /**
             * @description Frequency points, log-spaced.
             * @default 96
             */
            decayBins?: number;
            /**
             * @description Lowest plotted frequency, Hz.
             * @default 20
             */
            decayFromHz?: number;
            /**
             * @description Time slices of the plots.
             * @default 32
             */
            decaySlices?: number;
            /**
             * @description Arrival to the last slice, ms.
             * @default 300
             */
            decaySpanMs?: number;
            /**
             * @description Highest plotted frequency, Hz (at most Nyquist).
             * @default 20000
             */
            decayToHz?: number;
            /**
             * @description Sweep T (fades included), s.
             * @default 10
             */
            durationS?: number;
            /**
             * @description Sweep f2, Hz.
             * @default 20000
             */
            endHz?: number;
            /** @default 0.05 */
            fadeInS?: number;
            /** @default 0.01 */
            fadeOutS?: number;
            /** @description The recording (at most 20 MiB and 30 s). */
            file: string;
            /** @description Length of the part analysed, s (a sequence's periodS); default to the end of the file. */
            lengthS?: number;
            /**
             * @description Sweep sine peak as played, dBFS.
             * @default -12
             */
            levelDbfs?: number;
            /**
             * @default regularizedDivision
             * @enum {unknown}
             */
            method?: "regularizedDivision" | "inverseFilter";
            /** @description One of your microphones (`POST /v1/microphones`) — its calibration is subtracted from the response and, with its offset, the response is also given in dB SPL. */
            microphoneId?: components["schemas"]["MicrophoneId"];
            /**
             * @description Start of the part analysed, s into the file (a sequence slot's startS).
             * @default 0
             */
            offsetS?: number;
            /** @description 0-based channel holding the loopback (timing reference), if one was recorded. */
            referenceChannel?: number;
            /** @description Inside height (z), metres. */
            roomHeightM?: number;
            /** @description Inside length (y), metres. */
            roomLengthM?: number;
            /** @description Inside width (x), metres. */
            roomWidthM?: number;
            /**
             * @description Smoothing window in octaves, 1/48 (0.0208) to 1; default 1/12.
             * @default 0.08333333333333333
             */
            smoothingOctaves?: number;
            /**
             * @description Also answer a spectrogram: short-time spectra through a Hann window of `spectrogramWindowMs`,
             *     centred from the arrival to `decaySpanMs` after it.
             * @default false
             */
            spectrogram?: boolean;
            /**
             * @description Spectrogram window length, ms.
             * @default 50
             */
            spectrogramWindowMs?: number;
            /**
             * @description Sweep f1, Hz.
             * @default 20
             */
            startHz?: number;
            /**
             * @description Air temperature for the modes.
             * @default 20
             */
            temperatureC?: number;
            /**
             * @description Also answer a cumulative spectral decay (`waterfall`): the spectrum of what is left of the response
             *     from each slice's start to a fixed end `waterfallWindowMs` after the arrival, each slice starting
             *     `decaySpanMs/(decaySlices − 1)` later (Berman & Fincham, JAES 25(6), 1977); rectangular start,
             *     half-Hann end over the window's last fifth.
             * @default false
             */
            waterfall?: boolean;
            /**
             * @description Fixed end of the waterfall after the arrival, ms (longer than decaySpanMs).
             * @default 500
             */
            waterfallWindowMs?: number;
        };
        /**
         * @description The response a channel should reach, in dB relative to its own level. `flat`: 0 dB. `tilt`: a
         *     straight line of `dbPerOctave` through 0 dB at `pivotHz` (default 1000 Hz). `lowFrequencyLift`:
         *     `gainDb` at low frequencies falling to 0 dB, shaped like a second-order low shelf (Audio EQ Cookbook
         *     analogue prototype, S = 1) with half the gain at `cornerHz`. `points`: levels at frequencies,
         *     interpolated linearly in log frequency and held beyond the first and last point. `stored`: a target
         *     curve stored under `/v1/target-curves`, by its name. Default: flat.
         */
        TargetCurve: {
            /** @constant */
            kind: "flat";
        } | {
            dbPerOctave: number;
            /** @constant */
            kind: "tilt";
            /** @description Default 1000 Hz. */
            pivotHz?: number;
        } | {
            cornerHz: number;
            gainDb: number;
            /** @constant */
            kind: "lowFrequencyLift";
        } | {
            /** @constant */
            kind: "points";
            points: components["schemas"]["TargetPoints"];
        } | {
            /** @constant */
            kind: "stored";
            /** @description Name of one of your stored target curves. */
            name: string;
        };
        TargetCurveCreate: {
            name: string;
            notes?: string;
            points: components["schemas"]["TargetPoints"];
        };
        /** @description A target curve id, as `POST /v1/target-curves` answers it. */
        TargetCurveId: string;
        TargetCurveUpdate: {
            name?: string;
            notes?: string | null;
            points?: components["schemas"]["TargetPoints"];
        };
        TargetPoint: {
            frequencyHz: number;
            gainDb: number;
        };
        /** @description Levels at frequencies; frequencies strictly ascending. */
        TargetPoints: components["schemas"]["TargetPoint"][];
        TestSignal: {
            cautions: components["schemas"]["Caution"][];
            channelCount: number;
            durationS: number;
            /** @enum {unknown} */
            encoding: "pcm16" | "pcm24" | "float32";
            frameCount: number;
            /** @enum {unknown} */
            kind: "sweep" | "pinkNoise" | "sweepSequence";
            peakDbfs: number;
            pinkNoise?: {
                /** @enum {unknown} */
                band: "full" | "mid" | "low";
                crestFactorDb: number;
                fromHz: number;
                peakDbfs: number;
                /** @description Raw RMS (a full-scale sine reads −3.01 dBFS). */
                rmsDbfs: number;
                /** @description RMS + 3.01 dB (a full-scale sine reads 0 dB). */
                rmsDbfsSineReferenced: number;
                seed: number;
                toHz: number;
            };
            sampleRateHz: number;
            sequence?: {
                gapS: number;
                /** @description Sweep plus gap, s. */
                periodS: number;
                slots: {
                    channel: string;
                    channelIndex: number;
                    startS: number;
                    startSample: number;
                }[];
                timingReferenceChannelIndex: number | null;
            };
            /** @description Size of the WAV file, bytes. */
            sizeBytes: number;
            sweep?: {
                durationS: number;
                endHz: number;
                fadeInS: number;
                fadeOutS: number;
                formula: string;
                harmonicAdvanceS: {
                    advanceS: number;
                    harmonic: number;
                }[];
                /** @description Sine peak, dBFS. */
                levelDbfs: number;
                /** @description L = T/ln(f2/f1), s. */
                rateS: number;
                silenceAfterS: number;
                startHz: number;
            };
        };
        TestSignalRequest: {
            /**
             * @description Pink-noise band (common practice; default full).
             * @enum {unknown}
             */
            band?: "full" | "mid" | "low";
            /** @description Sweep sequence: the channels to sweep, in order; the file has one channel per label. */
            channels?: components["schemas"]["ChannelLabel"][];
            /**
             * @description Sweep: T, fades included, silence excluded. Noise: length. Seconds.
             * @default 10
             */
            durationS?: number;
            /**
             * @default pcm24
             * @enum {unknown}
             */
            encoding?: "pcm16" | "pcm24" | "float32";
            /** @description Sweep f2, Hz (≤ Nyquist; default 20000). */
            endHz?: number;
            /** @description Half-Hann fade-in, s (default 0.05). */
            fadeInS?: number;
            /** @description Half-Hann fade-out, s (default 0.01). */
            fadeOutS?: number;
            /** @description Sweep sequence: silence after each sweep, s (longer than the room's T60; default 3). */
            gapS?: number;
            /** @enum {unknown} */
            kind: "sweep" | "pinkNoise" | "sweepSequence";
            /** @description Sweep: sine peak, dBFS (default −12). Pink noise: RMS, dBFS raw (default −20). */
            levelDbfs?: number;
            /**
             * @description Sample rate of the file, Hz.
             * @default 48000
             */
            sampleRateHz?: number;
            /** @description Pink-noise phases (default 1). */
            seed?: number;
            /** @description Silence after a single sweep, s (default 2). */
            silenceAfterS?: number;
            /** @description Sweep f1, Hz (default 20). */
            startHz?: number;
            /** @description Sweep sequence: add a last channel carrying every sweep, for a loopback (default false). */
            timingReference?: boolean;
        };
        Tuning: components["schemas"]["TuningSettingsFields"] & {
            cautions: components["schemas"]["Caution"][];
            /** Format: date-time */
            createdAt: string;
            duplicatedFromId: string | null;
            id: string;
            latestVersion: number;
            name: string;
            notes: string | null;
            /** @enum {string} */
            origin: "settings" | "plan" | "edit" | "restore" | "duplicate";
            ownerId: string;
            /** @description Only on a tuning just made from a plan. */
            planWarnings?: components["schemas"]["Warning"][];
            /**
             * @description Settings that are not on the steps of the room's processor profile, each with the value
             *     its export gives the processor and by how much that differs; with a profile that takes
             *     delay in milliseconds, also delays that are not a whole number of samples at the tuning's
             *     rate. Empty without a profile or when every setting is on its step. Not a refusal: ranges
             *     are checked on every write (422 limit-exceeded), steps are rounded at export.
             */
            profileSteps: components["schemas"]["StepRounding"][];
            roomId: string;
            stale: components["schemas"]["TuningStale"] | null;
            /** Format: date-time */
            updatedAt: string;
            /** @description The version shown. */
            version: number;
            /** Format: date-time */
            versionCreatedAt: string;
        };
        TuningChannel: {
            bassManaged: boolean;
            delayMs: number;
            eq: components["schemas"]["FilterSpec"][];
            highPass: components["schemas"]["StoredCrossover"] | null;
            id: string;
            name?: string;
            /** @enum {string} */
            polarity: "normal" | "inverted";
            trimDb: number;
        };
        TuningChannelInput: {
            bassManaged?: boolean;
            delayMs?: number;
            eq?: components["schemas"]["FilterSpec"][];
            highPass?: components["schemas"]["StoredCrossover"] | null;
            id: components["schemas"]["ChannelLabel"];
            name?: string;
            /** @enum {string} */
            polarity?: "normal" | "inverted";
            trimDb?: number;
        };
        TuningChannelInputs: components["schemas"]["TuningChannelInput"][];
        TuningComparison: {
            channels: {
                bassManagedChanged: boolean;
                delayMsDifference: number | null;
                eqBands: {
                    left: number;
                    right: number;
                };
                eqChanged: boolean;
                highPassChanged: boolean;
                id: string;
                maxResponseDifferenceDb: number | null;
                polarityChanged: boolean;
                /** @enum {string} */
                presentIn: "both" | "left" | "right";
                trimDbDifference: number | null;
            }[];
            identical: boolean;
            left: components["schemas"]["TuningRef"];
            right: components["schemas"]["TuningRef"];
            subwoofer: {
                lfeGainDbDifference: number | null;
                lowPassChanged: boolean;
            };
        };
        /** @description Give exactly one of `channels` or `plan`. */
        TuningCreate: {
            channels?: components["schemas"]["TuningChannelInputs"];
            name: string;
            notes?: string;
            /** @description The body of POST /v1/plans; anything left out is taken from the stored room. */
            plan?: {
                channels?: components["schemas"]["PlanChannelInput"][];
                layout?: string;
                limits?: components["schemas"]["Limits"];
                listener?: components["schemas"]["RoomPoint"];
                room?: components["schemas"]["RoomDimensions"];
                sampleRateHz?: number;
                targets?: components["schemas"]["PlanTargets"];
                temperatureC?: number;
            };
            sampleRateHz?: components["schemas"]["SampleRateHz"];
            subwoofer?: components["schemas"]["TuningSubwoofer"] | null;
        };
        TuningExport: {
            bassManagement: {
                delayMs: number;
                delaySamples: number;
                lfeGainDb: number;
                lowPass: components["schemas"]["ExportedCrossover"] | null;
                /** @enum {string} */
                polarity: "normal" | "inverted";
                routing: {
                    from: string;
                    gainDb: number;
                    to: string;
                    /** @enum {string} */
                    via: "lowPass" | "direct";
                }[];
                subwoofer: string;
            } | null;
            channels: {
                bassManaged: boolean;
                delayMs: number;
                /** @description delayMs × fs / 1000: whole when the profile counts samples. */
                delaySamples: number;
                eq: {
                    coefficients: number[];
                    frequencyHz: number;
                    gainDb: number | null;
                    q: number;
                    type: components["schemas"]["FilterType"];
                }[];
                eqRounding: {
                    atHz: number | null;
                    maxDeviationDb: number;
                };
                highPass: components["schemas"]["ExportedCrossover"] | null;
                id: string;
                lowPass: components["schemas"]["ExportedCrossover"] | null;
                name?: string;
                /** @enum {string} */
                polarity: "normal" | "inverted";
                trimDb: number;
            }[];
            coefficientLayout: {
                decimalPlaces?: number;
                /** @enum {string} */
                feedbackSign: "plus" | "minus";
                /** @enum {string} */
                numberFormat: "decimal" | "float32" | "full";
                order: ("b0" | "b1" | "b2" | "a0" | "a1" | "a2")[];
            };
            header: {
                cautions: components["schemas"]["Caution"][];
                convention: string;
                /**
                 * Format: date-time
                 * @description When this version of the tuning was made.
                 */
                createdAt: string;
                isochronVersion: string;
                name: string;
                profile: {
                    id: string;
                    name: string;
                } | null;
                roomId: string;
                roomName: string;
                sampleRateHz: number;
                tuningId: string;
                version: number;
            };
            stale: components["schemas"]["TuningStale"] | null;
        };
        /** @description A tuning id, as `POST /v1/rooms/{roomId}/tunings` answers it. */
        TuningId: string;
        TuningRef: {
            name: string;
            tuningId: string;
            version: number;
        };
        TuningSettingsFields: {
            channels: components["schemas"]["TuningChannel"][];
            sampleRateHz: number;
            subwoofer: components["schemas"]["TuningSubwoofer"] | null;
        };
        /**
         * @description The room has changed since the settings of this version were made from it: the listening position,
         *     a loudspeaker's position, the limits, the sample rate or the processor profile. `since` is when the
         *     first of those changes was stored; `reasons` says what differs now, in words. A tuning made anew
         *     (from settings or from a plan) takes the room as it is; an edit, a restore or a copy keeps the room
         *     state its settings came from.
         */
        TuningStale: {
            /**
             * @example [
             *       "listener moved 0.80 m"
             *     ]
             */
            reasons: string[];
            /** Format: date-time */
            since: string;
        };
        TuningSubwoofer: {
            channel: components["schemas"]["ChannelLabel"];
            headroomDb?: number;
            lfeGainDb: number;
            lowPass: components["schemas"]["StoredCrossover"] | null;
        };
        TuningUpdate: {
            channels?: components["schemas"]["TuningChannelInputs"];
            name?: string;
            notes?: string | null;
            removeChannels?: string[];
            sampleRateHz?: number;
            subwoofer?: components["schemas"]["TuningSubwoofer"] | null;
        };
        TuningVerification: {
            arrivalSpread: {
                channels: string[];
                spreadMs: number | null;
                status: components["schemas"]["VerificationStatus"];
                timingReference: boolean | null;
            };
            channels: {
                arrival: {
                    arrivalMs: number | null;
                    deviationMs: number | null;
                    measurementIds: string[];
                    note?: string;
                    status: components["schemas"]["VerificationStatus"];
                };
                crossoverSum: {
                    atHz: number | null;
                    deepestDipDb: number | null;
                    fromHz: number | null;
                    measurementIds: string[];
                    status: components["schemas"]["VerificationStatus"];
                    toHz: number | null;
                };
                id: string;
                level: {
                    deviationDb: number | null;
                    expectedDb: number | null;
                    measuredDb: number | null;
                    measurementIds: string[];
                    status: components["schemas"]["VerificationStatus"];
                };
                response: {
                    fromHz: number | null;
                    largestAtHz: number | null;
                    largestDb: number | null;
                    measurementIds: string[];
                    micPositions: string[];
                    rmsDb: number | null;
                    status: components["schemas"]["VerificationStatus"];
                    toHz: number | null;
                };
            }[];
            micPosition: string | null;
            notes: string[];
            referenceDb: number | null;
            /** @enum {unknown} */
            referenceFrom: "promise" | "request" | "medianOfMeasured" | null;
            signOff: components["schemas"]["SignOff"] | null;
            tolerances: {
                /** @enum {unknown} */
                basis: "published" | "commonPractice";
                default: number;
                name: string;
                setByCaller: boolean;
                source: string;
                value: number;
            }[];
            tuningId: string;
            /** @enum {unknown} */
            verdict: "pass" | "warn" | "fail" | "incomplete";
            version: number;
        };
        TuningVersion: components["schemas"]["TuningSettingsFields"] & {
            /** Format: date-time */
            createdAt: string;
            /**
             * @description Who made this version: the user and, for a key, the key. Shown to that user and to admins;
             *     anyone else sees both null, as for a version whose author is not known.
             */
            createdBy: {
                keyId: string | null;
                userId: string | null;
            };
            name: string;
            notes: string | null;
            /** @enum {string} */
            origin: "settings" | "plan" | "edit" | "restore" | "duplicate";
            restoredFromVersion: number | null;
            /** @description The engineer's sign-off after verification (`PUT …/versions/{version}/sign-off`), or null. */
            signOff?: components["schemas"]["SignOff"] | null;
            tuningId: string;
            version: number;
        };
        UpdateKeyRequest: {
            expiresAt?: string | null;
            name?: components["schemas"]["KeyName"];
            rateLimitPerMinute?: components["schemas"]["KeyRateLimit"] | null;
        };
        UsageLimits: {
            /** @description The active keys of the one user the report covers; null when it covers everyone. */
            activeKeys: number | null;
            /** @description Requests per minute for a key without its own limit (DEFAULT_RATE_LIMIT_PER_MINUTE). */
            keyRateLimitPerMinute: number;
            /** @description Most keys one user may hold that are neither revoked nor expired (MAX_ACTIVE_KEYS_PER_USER). */
            maxActiveKeysPerUser: number;
            /** @description Requests per minute for all keys and the console session of one user together (USER_RATE_LIMIT_PER_MINUTE). */
            userRateLimitPerMinute: number;
        };
        UsageReport: {
            data: components["schemas"]["UsageRow"][];
            /** Format: date-time */
            from: string;
            /** @enum {string} */
            groupBy: "hour" | "day" | "route" | "key";
            limits: components["schemas"]["UsageLimits"];
            /** Format: date-time */
            to: string;
        };
        UsageRow: {
            /**
             * Format: date-time
             * @description Start of the hour or UTC day; null when grouped by route or key.
             */
            bucket: string | null;
            count: number;
            /** @description Calls answered with 4xx or 5xx. */
            errorCount: number;
            /** @description Null for console calls and when grouped by route. */
            keyId: string | null;
            keyName: string | null;
            /** @description Method and route template, e.g. `POST /v1/biquads`. */
            route: string | null;
            /** @description The key's owner or the signed-in user; null when grouped by route. */
            userId: string | null;
        };
        User: {
            /** Format: date-time */
            createdAt: string;
            email: string;
            id: string;
            /** Format: date-time */
            lastSignInAt: string | null;
            name: string | null;
            /** @enum {string} */
            role: "admin" | "developer" | "viewer";
            /** @enum {string} */
            status: "active" | "invited" | "disabled";
            /** Format: date-time */
            updatedAt: string;
        };
        UserId: string;
        UserInvitationResult: {
            invitation: {
                /** @description False when the mail could not be handed to a mail server. */
                emailSent: boolean;
                /** Format: date-time */
                expiresAt: string;
                /** @description The one-time link; give it only to the invited person. */
                url: string;
            };
            user: components["schemas"]["User"];
        };
        UserUpdateResult: components["schemas"]["User"] & {
            /** @description Only after a role change. The user's live keys whose effective role the change moved. */
            keys?: {
                /**
                 * @description What the key may do now; null when the owner's role allows no key (403 on use).
                 * @enum {string|null}
                 */
                effectiveRoleAfter: "calculate" | "tuning" | "admin" | null;
                /** @enum {string|null} */
                effectiveRoleBefore: "calculate" | "tuning" | "admin" | null;
                id: string;
                lastFour: string;
                name: string;
                prefix: string;
                /**
                 * @description The role the key was created with.
                 * @enum {string}
                 */
                role: "calculate" | "tuning" | "admin";
            }[];
        };
        /** @enum {unknown} */
        VerificationStatus: "pass" | "warn" | "fail" | "notMeasured";
        Warning: {
            /** @description Channel the warning is about, if any. */
            channel?: string;
            /** @example delayClamped */
            code: string;
            message: string;
        };
    };
    responses: {
        /** @description The request is malformed or a field is invalid. */
        BadRequest: {
            headers: {
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description Too many heavy calculations are running or waiting (type `heavy-work-busy`); retry after the seconds given in Retry-After. */
        Busy: {
            headers: {
                "Retry-After": components["headers"]["RetryAfter"];
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /**
         * @description A state-changing request authenticated by the session cookie lacks `X-Requested-With:
         *     isochron-console` or comes from another origin.
         */
        CrossSiteRequest: {
            headers: {
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description The key or user lacks the role this operation needs. */
        Forbidden: {
            headers: {
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description No such resource (or not visible to the caller). */
        NotFound: {
            headers: {
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description Rate limit exceeded. */
        TooManyRequests: {
            headers: {
                "Retry-After": components["headers"]["RetryAfter"];
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description No valid credentials. */
        Unauthorized: {
            headers: {
                "WWW-Authenticate"?: string;
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
        /** @description The request is well formed but a value cannot be used (for example a frequency at or above Nyquist), or a heavy calculation needed more working memory than one may use (type `calculation-too-large`, with `heapLimitMb`; the detail says what to make smaller). */
        Unprocessable: {
            headers: {
                [name: string]: unknown;
            };
            content: {
                "application/problem+json": components["schemas"]["Problem"];
            };
        };
    };
    parameters: {
        /**
         * @description Must be `isochron-console` on every state-changing request authenticated by the session cookie
         *     (all `/auth` writes, and `/v1` writes made without an API key). Pages on other sites cannot set it.
         */
        ConsoleRequest: "isochron-console";
        /** @description The key's `id` (not its secret). */
        KeyId: components["schemas"]["KeyId"];
        /** @description Page size. */
        Limit: number;
        MeasurementIdPath: components["schemas"]["MeasurementId"];
        /**
         * @description A microphone id from `POST /v1/microphones` or `GET /v1/microphones`.
         * @example mic_0mf3x1c2a9f8a7b6c5d4e
         */
        MicrophoneIdPath: components["schemas"]["MicrophoneId"];
        /** @example prof_0mf3x1d2a9f8a7b6c5d4e */
        ProfileIdPath: components["schemas"]["ProfileId"];
        /**
         * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
         * @example room_0mf3x1c2a9f8a7b6c5d4e
         */
        RoomIdPath: components["schemas"]["RoomId"];
        /** @description Cursor; the id of the last item of the previous page. */
        StartingAfter: string;
        /**
         * @description A target curve id from `POST /v1/target-curves` or `GET /v1/target-curves`.
         * @example tgc_0mf3x1c2a9f8a7b6c5d4e
         */
        TargetCurveIdPath: components["schemas"]["TargetCurveId"];
        TuningIdPath: components["schemas"]["TuningId"];
        TuningVersionPath: number;
        UserId: components["schemas"]["UserId"];
    };
    requestBodies: never;
    headers: {
        /** @description IETF RateLimit header (draft 8), one list member per policy: the calling key's own limit (named after its quota, for example "600-in-1min"), then the ceiling of the key's user over all their keys ("user"). */
        RateLimit: string;
        /** @description IETF RateLimit-Policy header (draft 8), one list member per policy, in the order of RateLimit. */
        RateLimitPolicy: string;
        /** @description Identifier of this request; also echoed as `requestId` in problem documents. */
        RequestId: string;
        /** @description Seconds to wait before retrying. */
        RetryAfter: number;
    };
    pathItems: never;
};
export type $defs = Record<string, never>;
export interface operations {
    acceptInvitation: {
        parameters: {
            query?: never;
            header: {
                /**
                 * @description Must be `isochron-console` on every state-changing request authenticated by the session cookie
                 *     (all `/auth` writes, and `/v1` writes made without an API key). Pages on other sites cannot set it.
                 */
                "X-Requested-With": components["parameters"]["ConsoleRequest"];
            };
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    password: string;
                    token: string;
                };
            };
        };
        responses: {
            /** @description Password set, user active and signed in. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SessionBody"];
                };
            };
            /** @description The request is malformed, or the token is unknown, already used or expired (named in `detail`). */
            400: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            403: components["responses"]["CrossSiteRequest"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getSession: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Signed in. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SessionBody"];
                };
            };
            /** @description Not signed in, or the session has ended. */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            404: components["responses"]["NotFound"];
        };
    };
    signIn: {
        parameters: {
            query?: never;
            header: {
                /**
                 * @description Must be `isochron-console` on every state-changing request authenticated by the session cookie
                 *     (all `/auth` writes, and `/v1` writes made without an API key). Pages on other sites cannot set it.
                 */
                "X-Requested-With": components["parameters"]["ConsoleRequest"];
            };
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    email: string;
                    password: string;
                };
            };
        };
        responses: {
            /** @description Signed in; `Set-Cookie` carries the session. */
            200: {
                headers: {
                    /** @description `isochron.sid=...; Path=/; HttpOnly; SameSite=Strict` (plus `Secure` in production). */
                    "Set-Cookie"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SessionBody"];
                };
            };
            400: components["responses"]["BadRequest"];
            /** @description The e-mail address or the password is wrong (the same answer for every reason). */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            403: components["responses"]["CrossSiteRequest"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    signOut: {
        parameters: {
            query?: never;
            header: {
                /**
                 * @description Must be `isochron-console` on every state-changing request authenticated by the session cookie
                 *     (all `/auth` writes, and `/v1` writes made without an API key). Pages on other sites cannot set it.
                 */
                "X-Requested-With": components["parameters"]["ConsoleRequest"];
            };
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Signed out; the cookie is cleared. */
            204: {
                headers: {
                    "Set-Cookie"?: string;
                    [name: string]: unknown;
                };
                content?: never;
            };
            403: components["responses"]["CrossSiteRequest"];
            404: components["responses"]["NotFound"];
        };
    };
    getHealth: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The process is up. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        /** @constant */
                        status: "ok";
                    };
                };
            };
            404: components["responses"]["NotFound"];
        };
    };
    getOpenApiDocument: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The OpenAPI 3.1 document. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": Record<string, never>;
                };
            };
            404: components["responses"]["NotFound"];
        };
    };
    getReadiness: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Ready to serve. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        dependencies: components["schemas"]["DependencyState"][];
                        /** @constant */
                        status: "ready";
                    };
                };
            };
            404: components["responses"]["NotFound"];
            /** @description A dependency does not answer, or the database cannot be written. */
            503: {
                headers: {
                    /** @description Seconds before asking again. */
                    "Retry-After"?: number;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"] & {
                        dependencies?: components["schemas"]["DependencyState"][];
                    };
                };
            };
        };
    };
    analyzeImpulseResponse: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": components["schemas"]["ImpulseResponseUpload"];
            };
        };
        responses: {
            /** @description The analysis. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ImpulseResponseAnalysis"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description The file is larger than 20 MiB. */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is not multipart/form-data. */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The file cannot be analysed (type `unusable-audio`, with `reason`), or a value cannot be used. */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    analyzeSweepRecording: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": components["schemas"]["SweepRecordingUpload"];
            };
        };
        responses: {
            /** @description The analysis. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SweepRecordingAnalysis"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description The file is larger than 20 MiB. */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is not multipart/form-data. */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The file cannot be analysed (type `unusable-audio`, with `reason`), or a value cannot be used. */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    planBassManagement: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["BassManagementRequest"];
            };
        };
        responses: {
            /** @description Each channel's role and high-pass, the subwoofer path and the headroom. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["BassManagementResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    designBiquads: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["BiquadsRequest"];
            };
        };
        responses: {
            /** @description One section per filter, in order, and the response of the cascade when asked. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["BiquadsResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    designCrossover: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["CrossoverRequest"];
            };
        };
        responses: {
            /** @description Both cascades, the high-pass polarity and, when asked, the responses. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["CrossoverResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    computeDelays: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["DelaysRequest"];
            };
        };
        responses: {
            /** @description The delay of every channel. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["DelaysResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    fitEq: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["EqFitRequest"];
            };
        };
        responses: {
            /** @description Bands, their sections, the predicted response and the residual error. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["EqFitResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    computeGeometry: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["GeometryRequest"];
            };
        };
        responses: {
            /** @description Distances, angles, deviations and rule warnings. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["GeometryResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listKeys: {
        parameters: {
            query?: {
                /** @description Also list revoked keys. */
                includeRevoked?: boolean;
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Only keys of this user. Another user's id needs `keys:all`. */
                ownerId?: components["schemas"]["UserId"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of keys. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["ApiKey"][];
                        /** @description True when another page follows. */
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createKey: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["CreateKeyRequest"];
            };
        };
        responses: {
            /** @description The new key, with its clear `secret` shown this once. */
            201: {
                headers: {
                    /** @description Path of the new key. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["CreatedApiKey"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description The owner already holds the most active keys one user may hold. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getKey: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The key's `id` (not its secret). */
                keyId: components["parameters"]["KeyId"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The key. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ApiKey"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    revokeKey: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The key's `id` (not its secret). */
                keyId: components["parameters"]["KeyId"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The revoked key. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ApiKey"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateKey: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description The key's `id` (not its secret). */
                keyId: components["parameters"]["KeyId"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["UpdateKeyRequest"];
            };
        };
        responses: {
            /** @description The key as changed. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ApiKey"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description The key is revoked, or it has expired and the request changes its expiry. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listLayouts: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Every layout. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["Layout"][];
                        /** @description Always false; the list is short and fixed. */
                        hasMore: boolean;
                    };
                };
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getLayout: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                layoutId: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The layout. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Layout"];
                };
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    computeLevels: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["LevelsRequest"];
            };
        };
        responses: {
            /** @description The trim of every channel. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["LevelsResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listMicrophones: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of microphones. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["Microphone"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createMicrophone: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["MicrophoneCreate"];
            };
        };
        responses: {
            /** @description The stored microphone. */
            201: {
                headers: {
                    /** @description URL of the new microphone. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Microphone"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getMicrophone: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A microphone id from `POST /v1/microphones` or `GET /v1/microphones`.
                 * @example mic_0mf3x1c2a9f8a7b6c5d4e
                 */
                microphoneId: components["parameters"]["MicrophoneIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The microphone. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Microphone"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteMicrophone: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A microphone id from `POST /v1/microphones` or `GET /v1/microphones`.
                 * @example mic_0mf3x1c2a9f8a7b6c5d4e
                 */
                microphoneId: components["parameters"]["MicrophoneIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateMicrophone: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A microphone id from `POST /v1/microphones` or `GET /v1/microphones`.
                 * @example mic_0mf3x1c2a9f8a7b6c5d4e
                 */
                microphoneId: components["parameters"]["MicrophoneIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["MicrophoneUpdate"];
            };
        };
        responses: {
            /** @description The changed microphone. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Microphone"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    readMicrophoneCalibrator: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A microphone id from `POST /v1/microphones` or `GET /v1/microphones`.
                 * @example mic_0mf3x1c2a9f8a7b6c5d4e
                 */
                microphoneId: components["parameters"]["MicrophoneIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": components["schemas"]["CalibratorUpload"];
            };
        };
        responses: {
            /** @description The microphone with its new offset, and the reading it came from. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        microphone: components["schemas"]["Microphone"];
                        reading: components["schemas"]["CalibratorReading"];
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description The file is larger than 20 MiB. */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is not multipart/form-data. */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    listOutbox: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of messages, newest first. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["OutboxMessage"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createPlan: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["PlanRequest"];
            };
        };
        responses: {
            /** @description The plan. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["RoomPlan"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    listProcessorProfiles: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of profiles. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["ProcessorProfile"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createProcessorProfile: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ProcessorProfileSettings"];
            };
        };
        responses: {
            /** @description The stored profile. */
            201: {
                headers: {
                    /** @description URL of the new profile. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ProcessorProfile"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getProcessorProfile: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @example prof_0mf3x1d2a9f8a7b6c5d4e */
                profileId: components["parameters"]["ProfileIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The profile. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ProcessorProfile"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    replaceProcessorProfile: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @example prof_0mf3x1d2a9f8a7b6c5d4e */
                profileId: components["parameters"]["ProfileIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["ProcessorProfileSettings"];
            };
        };
        responses: {
            /** @description The profile as now stored. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ProcessorProfile"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteProcessorProfile: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @example prof_0mf3x1d2a9f8a7b6c5d4e */
                profileId: components["parameters"]["ProfileIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description A room still uses the profile; choose another for it first. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    listRooms: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of rooms. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["Room"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createRoom: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RoomCreate"];
            };
        };
        responses: {
            /** @description The stored room. */
            201: {
                headers: {
                    /** @description URL of the new room. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Room"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getRoom: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The room. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Room"];
                };
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteRoom: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted, with every tuning, tuning version and measurement of the room. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateRoom: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RoomUpdate"];
            };
        };
        responses: {
            /** @description The changed room. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Room"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listMeasurements: {
        parameters: {
            query?: {
                channel?: components["schemas"]["ChannelLabel"];
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                stage?: components["schemas"]["MeasurementStage"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of measurements. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["Measurement"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createMeasurement: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["MeasurementCreate"];
                "multipart/form-data": components["schemas"]["MeasurementUpload"];
            };
        };
        responses: {
            /** @description The stored measurement with its analysis. */
            201: {
                headers: {
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Measurement"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description The file is larger than 20 MiB. */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is neither JSON nor multipart/form-data. */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    getMeasurement: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                measurementId: components["parameters"]["MeasurementIdPath"];
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The measurement. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Measurement"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteMeasurement: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                measurementId: components["parameters"]["MeasurementIdPath"];
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description No such measurement in this room (or the room is not yours). */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    averageMeasurements: {
        parameters: {
            query: {
                channel: components["schemas"]["ChannelLabel"];
                /** @description Which responses to average; required when the channel has both kinds. */
                kind?: "frequencyResponse" | "impulseResponse";
                /**
                 * @description Average the measurements taken before (default; what plans use) or after a tuning was loaded (what
                 *     verification uses). The two are never averaged together.
                 */
                stage?: "before" | "after";
            };
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The averaged response. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        channel: string;
                        frequenciesHz: number[];
                        magnitudeDb: number[];
                        measurementIds: string[];
                        micPositions: string[];
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    planStoredRoom: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["RoomPlanRequest"];
            };
        };
        responses: {
            /** @description The plan (nothing stored). */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StoredRoomPlan"];
                };
            };
            /** @description The plan, stored as a new tuning (`store: true`). */
            201: {
                headers: {
                    /** @description URL of the new tuning. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StoredRoomPlan"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    getRoomReport: {
        parameters: {
            query?: {
                tuningId?: components["schemas"]["TuningId"];
                version?: number;
            };
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The report. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "text/html": string;
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listRoomTunings: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of tunings. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["Tuning"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createRoomTuning: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A room id from `POST /v1/rooms` or `GET /v1/rooms`.
                 * @example room_0mf3x1c2a9f8a7b6c5d4e
                 */
                roomId: components["parameters"]["RoomIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TuningCreate"];
            };
        };
        responses: {
            /** @description The stored tuning at version 1. */
            201: {
                headers: {
                    /** @description URL of the new tuning. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Tuning"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
            503: components["responses"]["Busy"];
        };
    };
    listTargetCurves: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of target curves. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["StoredTargetCurve"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createTargetCurve: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TargetCurveCreate"];
            };
        };
        responses: {
            /** @description The stored target curve. */
            201: {
                headers: {
                    /** @description URL of the new target curve. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StoredTargetCurve"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description You already have a target curve of that name. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getTargetCurve: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A target curve id from `POST /v1/target-curves` or `GET /v1/target-curves`.
                 * @example tgc_0mf3x1c2a9f8a7b6c5d4e
                 */
                targetCurveId: components["parameters"]["TargetCurveIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The target curve. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StoredTargetCurve"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteTargetCurve: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A target curve id from `POST /v1/target-curves` or `GET /v1/target-curves`.
                 * @example tgc_0mf3x1c2a9f8a7b6c5d4e
                 */
                targetCurveId: components["parameters"]["TargetCurveIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateTargetCurve: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /**
                 * @description A target curve id from `POST /v1/target-curves` or `GET /v1/target-curves`.
                 * @example tgc_0mf3x1c2a9f8a7b6c5d4e
                 */
                targetCurveId: components["parameters"]["TargetCurveIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TargetCurveUpdate"];
            };
        };
        responses: {
            /** @description The changed target curve. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["StoredTargetCurve"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description You already have a target curve of that name. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    createTestSignal: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TestSignalRequest"];
            };
        };
        responses: {
            /** @description The WAV file, or its description with `Accept: application/json`. */
            200: {
                headers: {
                    /** @description The test-signal caution in plain ASCII (start quietly, protect hearing, protect drivers). */
                    "Test-Signal-Caution"?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TestSignal"];
                    "audio/wav": string;
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description Neither `audio/wav` nor `application/json` is acceptable to the client. */
            406: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getTuning: {
        parameters: {
            query?: {
                /** @description A version number; default the latest. */
                version?: number;
            };
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The tuning. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Tuning"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    deleteTuning: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Deleted. */
            204: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description No such tuning (or not visible to the caller). */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateTuning: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["TuningUpdate"];
            };
        };
        responses: {
            /** @description The tuning at its new version. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Tuning"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    duplicateTuning: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: {
            content: {
                "application/json": {
                    name?: string;
                    version?: number;
                };
            };
        };
        responses: {
            /** @description The copy. */
            201: {
                headers: {
                    /** @description URL of the copy. */
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Tuning"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    exportTuning: {
        parameters: {
            query?: {
                format?: "json" | "csv";
                /**
                 * @description A processor profile id (one of yours), or `none` for the exact export; default the room's profile.
                 * @example prof_0mf3x1d2a9f8a7b6c5d4e
                 */
                profile?: string;
                /** @example 96000 */
                sampleRateHz?: number;
                version?: number;
            };
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The tuning for the processor. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TuningExport"];
                    "text/csv": string;
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getTuningVerification: {
        parameters: {
            query?: {
                /** @description Default 0.1 ms (ITU-R BS.2051-3, Table 1 note 1). */
                arrivalToleranceMs?: number;
                /** @description Default 3 dB (common practice). */
                crossoverDipToleranceDb?: number;
                /** @description Default 0.5 dB (common practice). */
                levelToleranceDb?: number;
                /** @description Position whose arrivals and SPL readings count; default the one with the most of them. */
                micPosition?: string;
                /** @description Reference level to check levels against, when the tuning promised none (or to override it). */
                referenceDb?: number;
                /** @description Default 3 dB (common practice). */
                responseMaxToleranceDb?: number;
                /** @description Default 1.5 dB (common practice). */
                responseRmsToleranceDb?: number;
                version?: number;
            };
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The verification. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TuningVerification"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listTuningVersions: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of versions. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["TuningVersion"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getTuningVersion: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
                version: components["parameters"]["TuningVersionPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The version, as stored. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TuningVersion"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    restoreTuningVersion: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
                version: components["parameters"]["TuningVersionPath"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The tuning at its new version. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Tuning"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    signOffTuningVersion: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                tuningId: components["parameters"]["TuningIdPath"];
                version: components["parameters"]["TuningVersionPath"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": components["schemas"]["SignOffRequest"];
            };
        };
        responses: {
            /** @description The sign-off as stored. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SignOffResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    compareTunings: {
        parameters: {
            query: {
                /** @example tun_0mf3x2a1b9f8a7b6c5d4e */
                left: components["schemas"]["TuningId"];
                leftVersion?: number;
                /** @example tun_0mf3x2b7c1d2e3f4a5b6c */
                right: components["schemas"]["TuningId"];
                rightVersion?: number;
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The differences. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["TuningComparison"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    getUsage: {
        parameters: {
            query?: {
                /** @description Start of the range (inclusive), RFC 3339. Default 7 days before `to`. */
                from?: string;
                /** @description One row per key, route and `hour` or `day`; or per `route`; or per `key`. */
                groupBy?: "hour" | "day" | "route" | "key";
                /** @description Only this key. */
                keyId?: components["schemas"]["KeyId"];
                /** @description Only this route template, exactly as it appears in `route`, e.g. `POST /v1/biquads`. */
                route?: string;
                /** @description End of the range (exclusive), RFC 3339. Default now. */
                to?: string;
                /** @description Only keys of this user and this user's console calls. Another user needs `usage:all`. */
                userId?: components["schemas"]["UserId"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The usage report. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["UsageReport"];
                    "text/csv": string;
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            422: components["responses"]["Unprocessable"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    listUsers: {
        parameters: {
            query?: {
                /** @description Page size. */
                limit?: components["parameters"]["Limit"];
                /** @description Cursor; the id of the last item of the previous page. */
                startingAfter?: components["parameters"]["StartingAfter"];
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of users. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        data: components["schemas"]["User"][];
                        hasMore: boolean;
                    };
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    inviteUser: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    /** Format: email */
                    email: string;
                    name?: string;
                    /** @enum {string} */
                    role: "admin" | "developer" | "viewer";
                };
            };
        };
        responses: {
            /** @description Invited. */
            201: {
                headers: {
                    Location?: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["UserInvitationResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            /** @description A user with this e-mail address exists. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    getUser: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                userId: components["parameters"]["UserId"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The user. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["User"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
    updateUser: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                userId: components["parameters"]["UserId"];
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    name?: string | null;
                    /** @enum {string} */
                    role?: "admin" | "developer" | "viewer";
                    /** @enum {string} */
                    status?: "active" | "disabled";
                };
            };
        };
        responses: {
            /** @description The user after the change. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["UserUpdateResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description The change is not allowed (your own role or status, or activating someone who has not accepted). */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    reissueInvitation: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                userId: components["parameters"]["UserId"];
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description A new link was issued. */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["UserInvitationResult"];
                };
            };
            400: components["responses"]["BadRequest"];
            401: components["responses"]["Unauthorized"];
            403: components["responses"]["Forbidden"];
            404: components["responses"]["NotFound"];
            /** @description The user has already accepted or is disabled. */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            429: components["responses"]["TooManyRequests"];
        };
    };
    getCurrentUser: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The user. */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["User"];
                };
            };
            401: components["responses"]["Unauthorized"];
            404: components["responses"]["NotFound"];
            429: components["responses"]["TooManyRequests"];
        };
    };
}

/** Per operation, the query parameters and top-level body properties that validation fills in with their default. */
export type ValidatedDefaults = {
  acceptInvitation: { query: never; body: never };
  analyzeImpulseResponse: { query: never; body: "smoothingOctaves" | "temperatureC" | "waterfall" | "spectrogram" | "decaySlices" | "decayBins" | "decayFromHz" | "decayToHz" | "decaySpanMs" | "waterfallWindowMs" | "spectrogramWindowMs" };
  analyzeSweepRecording: { query: never; body: "startHz" | "endHz" | "durationS" | "fadeInS" | "fadeOutS" | "levelDbfs" | "method" | "offsetS" | "smoothingOctaves" | "temperatureC" | "waterfall" | "spectrogram" | "decaySlices" | "decayBins" | "decayFromHz" | "decayToHz" | "decaySpanMs" | "waterfallWindowMs" | "spectrogramWindowMs" };
  averageMeasurements: { query: "stage"; body: never };
  compareTunings: { query: never; body: never };
  computeDelays: { query: never; body: never };
  computeGeometry: { query: never; body: "angleToleranceDeg" };
  computeLevels: { query: never; body: never };
  createKey: { query: never; body: "kind" };
  createMeasurement: { query: never; body: "micPosition" | "smoothingOctaves" | "temperatureC" };
  createMicrophone: { query: never; body: never };
  createPlan: { query: never; body: never };
  createProcessorProfile: { query: never; body: never };
  createRoom: { query: never; body: never };
  createRoomTuning: { query: never; body: never };
  createTargetCurve: { query: never; body: never };
  createTestSignal: { query: never; body: "sampleRateHz" | "encoding" | "durationS" };
  deleteMeasurement: { query: never; body: never };
  deleteMicrophone: { query: never; body: never };
  deleteProcessorProfile: { query: never; body: never };
  deleteRoom: { query: never; body: never };
  deleteTargetCurve: { query: never; body: never };
  deleteTuning: { query: never; body: never };
  designBiquads: { query: never; body: never };
  designCrossover: { query: never; body: never };
  duplicateTuning: { query: never; body: never };
  exportTuning: { query: "format"; body: never };
  fitEq: { query: never; body: "maxBoostDb" | "maxCutDb" | "minGainDb" };
  getCurrentUser: { query: never; body: never };
  getHealth: { query: never; body: never };
  getKey: { query: never; body: never };
  getLayout: { query: never; body: never };
  getMeasurement: { query: never; body: never };
  getMicrophone: { query: never; body: never };
  getOpenApiDocument: { query: never; body: never };
  getProcessorProfile: { query: never; body: never };
  getReadiness: { query: never; body: never };
  getRoom: { query: never; body: never };
  getRoomReport: { query: never; body: never };
  getSession: { query: never; body: never };
  getTargetCurve: { query: never; body: never };
  getTuning: { query: never; body: never };
  getTuningVerification: { query: never; body: never };
  getTuningVersion: { query: never; body: never };
  getUsage: { query: "groupBy"; body: never };
  getUser: { query: never; body: never };
  inviteUser: { query: never; body: never };
  listKeys: { query: "limit" | "includeRevoked"; body: never };
  listLayouts: { query: never; body: never };
  listMeasurements: { query: "limit"; body: never };
  listMicrophones: { query: "limit"; body: never };
  listOutbox: { query: "limit"; body: never };
  listProcessorProfiles: { query: "limit"; body: never };
  listRoomTunings: { query: "limit"; body: never };
  listRooms: { query: "limit"; body: never };
  listTargetCurves: { query: "limit"; body: never };
  listTuningVersions: { query: "limit"; body: never };
  listUsers: { query: "limit"; body: never };
  planBassManagement: { query: never; body: "lfeGainDb" | "subwooferCount" | "headroomWarningDb" };
  planStoredRoom: { query: never; body: "store" };
  readMicrophoneCalibrator: { query: never; body: never };
  reissueInvitation: { query: never; body: never };
  replaceProcessorProfile: { query: never; body: never };
  restoreTuningVersion: { query: never; body: never };
  revokeKey: { query: never; body: never };
  signIn: { query: never; body: never };
  signOffTuningVersion: { query: never; body: never };
  signOut: { query: never; body: never };
  updateKey: { query: never; body: never };
  updateMicrophone: { query: never; body: never };
  updateRoom: { query: never; body: never };
  updateTargetCurve: { query: never; body: never };
  updateTuning: { query: never; body: never };
  updateUser: { query: never; body: never };
};
