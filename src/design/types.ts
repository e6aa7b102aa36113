/**
 * The design file as TypeScript types: what {@link validateDesign} returns. The zod schema in
 * schema.ts checks exactly these shapes (a compile-time assertion keeps the two equal).
 * Units are in the field names; docs/design.md describes every field.
 * @module
 */
import type { WireLoad, WirePort, WireSpec } from '../wire/types.js';

/**
 * A complex value in a design file: a real number or `{re, im}`.
 * @category Design
 */
export type DesignComplex = number | {
  /** Real part. */
  readonly re: number;
  /** Imaginary part. */
  readonly im: number;
};

/**
 * Band of a design: one frequency, a strictly increasing list, or equal steps.
 * @category Design
 */
export type DesignFrequencies = number | readonly number[] | {
  /** First frequency [Hz], > 0. */
  readonly fromHz: number;
  /** Last frequency [Hz], ≥ fromHz. */
  readonly toHz: number;
  /** Number of points, 1 … 10 000. */
  readonly count: number;
};

/**
 * Element positions: a line, a rectangular grid, a triangular lattice inside a boundary, or a list.
 * @category Design
 */
export type DesignLayout =
  | {
    /** Discriminator: "line". */
    readonly kind: 'line';
    /** Number of elements. */
    readonly count: number;
    /** Spacing [m]. */
    readonly spacingM: number;
    /** Axis of the line. @defaultValue 'x' */
    readonly axis?: 'x' | 'y';
  }
  | {
    /** Discriminator: "rectangular". */
    readonly kind: 'rectangular';
    /** Elements along x. */
    readonly countX: number;
    /** Elements along y. */
    readonly countY: number;
    /** Spacing along x [m]. */
    readonly spacingXM: number;
    /** Spacing along y [m]. */
    readonly spacingYM: number;
  }
  | {
    /** Discriminator: "triangular". */
    readonly kind: 'triangular';
    /** Lattice spacing [m] (equilateral triangles). */
    readonly spacingM: number;
    /** Boundary: a circle of radius [m] or a hexagon of circumradius [m] and rotation [deg]. */
    readonly boundary:
      | {
        /** Discriminator: "circle". */
        readonly kind: 'circle';
        /** Radius [m]. */
        readonly radiusM: number;
      }
      | {
        /** Discriminator: "hexagon". */
        readonly kind: 'hexagon';
        /** Circumradius [m]. */
        readonly circumradiusM: number;
        /** Rotation [deg]. @defaultValue 0 */
        readonly rotationDeg?: number;
      };
  }
  | {
    /** Discriminator: "positions". */
    readonly kind: 'positions';
    /** Positions [x, y, z] [m]. */
    readonly positionsM: ReadonlyArray<readonly [number, number, number]>;
  };

/**
 * Elements: analytic thin-wire dipoles (one-mode induced-EMF model, re-evaluated per
 * frequency), one wire element solved by the thin-wire method of moments at every frequency
 * (wire module, docs/wire.md), or imported network + embedded-pattern data.
 * @category Design
 */
export type DesignElements =
  | {
    /** Discriminator: "dipole". */
    readonly kind: 'dipole';
    /** Length tip to tip [m]. */
    readonly lengthM: number;
    /** Wire radius [m]. */
    readonly radiusM: number;
    /** Axis direction (any non-zero length). */
    readonly axis: readonly [number, number, number];
    /** Height of the feed points over a PEC ground plane at z = 0 [m]; no ground plane when absent. */
    readonly groundPlaneHeightM?: number;
  }
  | {
    /**
     * Discriminator: "crossedDipole" — two orthogonal one-mode dipoles at every position (a
     * dual-polarised element), both ports in the coupled network: port 2n is element n's X
     * dipole, port 2n + 1 its Y dipole.
     */
    readonly kind: 'crossedDipole';
    /** Length of each dipole tip to tip [m]. */
    readonly lengthM: number;
    /** Wire radius [m]. */
    readonly radiusM: number;
    /** Azimuth of the X dipole from +x toward +y [deg]; the Y dipole lies 90° further. @defaultValue 0 */
    readonly rotationDeg?: number;
    /** Height of the feed points over a PEC ground plane at z = 0 [m]; no ground plane when absent. */
    readonly groundPlaneHeightM?: number;
  }
  | {
    /** Discriminator: "wire". */
    readonly kind: 'wire';
    /** The element's wires in its own coordinates (the wire module's WireSpec) [m]. */
    readonly wires: ReadonlyArray<WireSpec>;
    /** The element's one port: wire index and arc-length fraction (the wire module's WirePort, unnamed). */
    readonly port: Omit<WirePort, 'name'>;
    /** Lumped loads (the wire module's WireLoad, with impedanceOhm a number or {re, im} [Ω]). */
    readonly loads?: ReadonlyArray<Omit<WireLoad, 'impedanceOhm'> & {
      /** Complex impedance [Ω] (fixed; excludes R, L, C). */
      readonly impedanceOhm?: DesignComplex;
    }>;
    /** Height of the element's origin over a PEC ground plane at z = 0 [m]; no ground plane when absent. */
    readonly groundPlaneHeightM?: number;
    /** Longest segment [wavelengths]. @defaultValue 0.05 */
    readonly maxSegmentWavelengths?: number;
  }
  | {
    /** Discriminator: "imported". */
    readonly kind: 'imported';
    /** Touchstone file of the array's ports (any number of frequencies). */
    readonly touchstoneFile: string;
    /** Embedded-pattern file(s), one per frequency (.json or .csv layout of the element module). */
    readonly patternFile: string | readonly string[];
    /** Interpolate patterns linearly between neighbouring files. @defaultValue false (a band point needs a file within 0.1 %) */
    readonly interpolatePatterns?: boolean;
  };

/**
 * The receiver back end folded in by the Friis cascade.
 * @category Design
 */
export interface DesignBackEnd {
  /** LNA available gain [dB] (power ratio). */
  readonly gainDb?: number;
  /** Noise temperature of the stage after the LNA [K], ≥ 0. @defaultValue 0 */
  readonly secondStageTemperatureK?: number;
}

/**
 * Amplifier noise parameters: fixed, a table versus frequency, or a two-port Touchstone file
 * with a noise block; each with an optional back end.
 * @category Design
 */
export type DesignAmplifiers =
  | (DesignBackEnd & {
    /** Minimum noise temperature T_min [K]. */
    readonly minimumNoiseTemperatureK: number;
    /** Noise resistance R_n [Ω]. */
    readonly noiseResistanceOhm: number;
    /** Optimum source admittance Y_opt [S]. */
    readonly optimumSourceAdmittanceS: DesignComplex;
  })
  | (DesignBackEnd & {
    /** Rows versus frequency (≥ 2, increasing), interpolated linearly. */
    readonly table: {
      /** Row frequencies [Hz]. */
      readonly frequencyHz: readonly number[];
      /** T_min per row [K]. */
      readonly minimumNoiseTemperatureK: readonly number[];
      /** R_n per row [Ω]. */
      readonly noiseResistanceOhm: readonly number[];
      /** Y_opt per row [S]. */
      readonly optimumSourceAdmittanceS: readonly DesignComplex[];
    };
  })
  | (DesignBackEnd & {
    /** A two-port Touchstone file with a noise-parameter block. */
    readonly touchstoneFile: string;
  });

/**
 * Noise environment: sky (constant or power law), ground, tilt and physical temperature.
 * @category Design
 */
export interface DesignEnvironment {
  /** Sky brightness [K], or T_ref·(ν/ν_ref)^(−β) + T_bg. */
  readonly skyK: number | {
    /** Galactic brightness at the reference frequency [K]. */
    readonly referenceK: number;
    /** Reference frequency [Hz]. */
    readonly referenceHz: number;
    /** Spectral index β. @defaultValue 2.55 */
    readonly spectralIndex?: number;
    /** Background [K]. @defaultValue 2.725 */
    readonly backgroundK?: number;
  };
  /** Ground brightness [K]. @defaultValue 290 */
  readonly groundK?: number;
  /** Tilt of the array's broadside from the zenith [deg]. @defaultValue 0 */
  readonly tiltDeg?: number;
  /** Azimuth of the tilt [deg]. @defaultValue 0 */
  readonly tiltAzimuthDeg?: number;
  /** Physical temperature of the array [K]. @defaultValue 290 */
  readonly physicalTemperatureK?: number;
}

/**
 * A taper for the taper beamformer.
 * @category Design
 */
export type DesignTaper =
  | {
    /** Discriminator: "uniform". */
    readonly kind: 'uniform';
  }
  | {
    /** Discriminator: "cosine". */
    readonly kind: 'cosine';
    /** Pedestal in [0, 1]. @defaultValue 0 */
    readonly pedestal?: number;
  }
  | {
    /** Discriminator: "circular-taylor". */
    readonly kind: 'circular-taylor';
    /** Design sidelobe level, positive dB below the peak. */
    readonly sidelobeDb: number;
    /** Taylor n̄. @defaultValue 5 */
    readonly nbar?: number;
  };

/**
 * Beams: exactly one of a scan plane (`thetaDeg`), `pointings` or a `cone`, and the beamformer.
 * @category Design
 */
export interface DesignBeamsSpec {
  /** Azimuth of the scan plane [deg] (with thetaDeg). @defaultValue 0 */
  readonly planePhiDeg?: number;
  /** Signed scan angles in the plane [deg], or equal steps. */
  readonly thetaDeg?: readonly number[] | {
    /** First angle [deg]. */
    readonly fromDeg: number;
    /** Last angle [deg]. */
    readonly toDeg: number;
    /** Number of angles. */
    readonly count: number;
  };
  /** Beam directions θ [deg] from broadside, φ [deg] from +x. */
  readonly pointings?: ReadonlyArray<{
    /** θ from broadside [deg], 0 … 90. */
    readonly thetaDeg: number;
    /** φ from +x toward +y [deg]. */
    readonly phiDeg: number;
  }>;
  /** A cone to maxThetaDeg [deg] filled on a u-v grid of step stepUV (direction cosines). */
  readonly cone?: {
    /** Half-angle of the cone [deg], 0 … 89. */
    readonly maxThetaDeg: number;
    /** Grid step in u and v (direction cosines), 0.005 … 2. */
    readonly stepUV: number;
  };
  /** Beamformer. @defaultValue 'max-snr' */
  readonly beamformer?: 'max-snr' | 'conjugate-field' | 'taper';
  /** The taper of the taper beamformer. */
  readonly taper?: DesignTaper;
}

/**
 * Random errors of a design's channels (zero-mean, independent per element).
 * @category Design
 */
export interface DesignRandomErrors {
  /** Distribution of every error. @defaultValue 'gaussian' */
  readonly distribution?: 'gaussian' | 'uniform';
  /** RMS amplitude error [dB] (relative amplitude error δ = 10^(dB/20) − 1). */
  readonly amplitudeDb?: number;
  /** RMS phase error [deg]. */
  readonly phaseDeg?: number;
  /** RMS position error per axis [m]. */
  readonly positionM?: number;
}

/**
 * Failed elements of a design: which (a list, or a seeded random fraction) and how their ports
 * are terminated. The failed ports stay in the coupled network at every band frequency
 * (imperfect module's failedArrayPorts); the beamformer uses the working ports only.
 * @category Design
 */
export interface DesignFailures {
  /** Indices of the failed elements (0-based, layout order, distinct); exactly one of `elements` and `fraction`. */
  readonly elements?: readonly number[];
  /** Fraction of the elements that failed, 0 … 1 (round(fraction·N) elements chosen at random). */
  readonly fraction?: number;
  /** Seed of the random choice (integer ≥ 0; with `fraction`). @defaultValue 1 */
  readonly seed?: number;
  /** How each failed port is terminated: left open, in a matched load, or in its dead amplifier's input impedance. */
  readonly termination: 'open' | 'matched' | 'amplifier';
  /** Matched-load resistance [Ω], > 0 (with termination "matched"). @defaultValue 50 */
  readonly referenceOhm?: number;
  /** Input impedance of the dead amplifier [Ω], Re ≥ 0 (required with termination "amplifier"). */
  readonly amplifierInputOhm?: DesignComplex;
}

/**
 * Contiguous subarrays of a design's layout (imperfect module's gridSubarrays).
 * @category Design
 */
export interface DesignSubarrays {
  /** Elements per subarray along x (a rectangular layout) or along a line layout; divides that count. */
  readonly perX: number;
  /** Elements per subarray along y (rectangular layouts; divides countY). @defaultValue 1 */
  readonly perY?: number;
}

/**
 * Hardware imperfections of a design: random errors, failed elements, phase-shifter and
 * digital-weight bits, and how the beams are steered across the band (docs/imperfect.md).
 * @category Design
 */
export interface DesignImperfections {
  /** Random amplitude, phase and position errors. */
  readonly errors?: DesignRandomErrors;
  /** Failed elements, carried through the coupled network. */
  readonly failures?: DesignFailures;
  /** Phase-shifter bits k, 1 … 16. */
  readonly phaseBits?: number;
  /** Digital weight word length per real component, 2 … 32. */
  readonly weightBits?: number;
  /**
   * Contiguous subarrays on the layout's lattice: blocks of perX × perY elements of a
   * rectangular layout, or of perX elements along a line layout (perY 1 or absent).
   */
  readonly subarrays?: DesignSubarrays;
  /**
   * Steering hardware across the band: phase shifters set at the band centre, true time delay
   * per element, or phase shifters within each subarray and true time delay between subarrays
   * (needs `subarrays`). @defaultValue 'phase'
   */
  readonly steering?: 'phase' | 'elementDelay' | 'subarrayDelay';
}

/**
 * A validated design file.
 * @category Design
 */
export interface Design {
  /** Title of the report. */
  readonly title?: string;
  /** The band [Hz]. */
  readonly frequencyHz: DesignFrequencies;
  /** Noise bandwidth B [Hz]. */
  readonly bandwidthHz: number;
  /** Element positions. */
  readonly layout: DesignLayout;
  /** Element model or imported data. */
  readonly elements: DesignElements;
  /** Amplifiers; noiseless receivers when absent. */
  readonly amplifiers?: DesignAmplifiers;
  /** Noise environment. */
  readonly environment: DesignEnvironment;
  /** Beams and beamformer. */
  readonly beams: DesignBeamsSpec;
  /** Physical area for the aperture efficiency [m²]. */
  readonly physicalAreaM2?: number;
  /** Sphere rule of the noise integrals (θ × φ nodes); sized automatically when absent. */
  readonly quadrature?: {
    /** Gauss–Legendre nodes in θ. */
    readonly thetaCount: number;
    /** Uniform nodes in φ. */
    readonly phiCount: number;
  };
  /** Hardware imperfections: random errors, failed elements, bits, steering hardware. */
  readonly imperfections?: DesignImperfections;
  /** Frequencies [Hz] the report draws cuts, maps and Smith charts at (nearest band points). */
  readonly report?: {
    /** Frequencies [Hz]. @defaultValue the lowest, centre and highest band points */
    readonly frequenciesHz?: readonly number[];
  };
}
