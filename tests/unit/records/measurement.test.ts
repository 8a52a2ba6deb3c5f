import { measurementCreateSchema } from '../../../shared/records/measurement';
import { issuesOf } from '../../support/zod-issues';

const now = new Date('2025-06-12T12:00:00Z');
beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(now);
});
afterEach(() => {
  vi.useRealTimers();
});

const takenAt = '2025-06-12T11:00:00Z';
const parse = (body: Record<string, unknown>) => issuesOf(measurementCreateSchema.safeParse({ takenAt, ...body }));

describe('measurementCreateSchema', () => {
  it('accepts a full measurement', () => {
    const result = measurementCreateSchema.safeParse({
      takenAt,
      girthInjuredCm: 52.5,
      girthOtherCm: 50,
      girthLandmark: 'Superior pole of patella',
      girthDistanceCm: 20, // Harrelson et al., J Sport Rehabil 1998;7(4): site 20 cm above the joint line (title not retrieved)
      kneeFlexionDeg: 95,
      painNprs: 4,
      bruiseLengthCm: 8,
      bruiseWidthCm: 5,
      skinfoldMm: 14,
      notes: 'Tender over vastus lateralis',
    });
    expect(result.success).toBe(true);
  });

  describe('ranges (validation bounds of ours unless marked)', () => {
    it('rejects knee flexion of 161° with a message naming the range', () => {
      expect(parse({ kneeFlexionDeg: 161 })).toEqual([
        { path: 'kneeFlexionDeg', message: 'Knee flexion must be a whole number between 0 and 160°' },
      ]);
    });

    it('accepts knee flexion at 0° and 160°', () => {
      expect(parse({ kneeFlexionDeg: 0 })).toEqual([]);
      expect(parse({ kneeFlexionDeg: 160 })).toEqual([]);
    });

    it('rejects a fractional knee flexion', () => {
      expect(parse({ kneeFlexionDeg: 90.5 })[0].path).toBe('kneeFlexionDeg');
    });

    it('rejects pain of 11 and of −1 on the 0–10 NPRS', () => {
      // NPRS 0–10: Farrar et al., Pain 2001;94(2):149–158
      expect(parse({ painNprs: 11 })).toEqual([{ path: 'painNprs', message: 'Pain (NPRS) must be a whole number between 0 and 10' }]);
      expect(parse({ painNprs: -1 })[0].path).toBe('painNprs');
    });

    it('rejects a girth of 9.9 cm and of 120.1 cm', () => {
      const low = parse({ girthInjuredCm: 9.9, girthOtherCm: 50, girthLandmark: 'Patella', girthDistanceCm: 10 });
      expect(low).toEqual([{ path: 'girthInjuredCm', message: 'Girth of the injured side must be between 10 and 120 cm' }]);
      const high = parse({ girthInjuredCm: 50, girthOtherCm: 120.1, girthLandmark: 'Patella', girthDistanceCm: 10 });
      expect(high[0].path).toBe('girthOtherCm');
    });

    it('rejects a girth distance over 40 cm', () => {
      const result = parse({ girthInjuredCm: 50, girthOtherCm: 49, girthLandmark: 'Patella', girthDistanceCm: 41 });
      expect(result).toEqual([{ path: 'girthDistanceCm', message: 'Girth distance from the landmark must be between 0 and 40 cm' }]);
    });

    it('rejects a bruise longer than 60 cm', () => {
      expect(parse({ bruiseLengthCm: 61, bruiseWidthCm: 4 })[0]).toEqual({
        path: 'bruiseLengthCm',
        message: 'Bruise length must be between 0 and 60 cm',
      });
    });

    it('rejects a skinfold below 1 mm or above 60 mm', () => {
      expect(parse({ skinfoldMm: 0.5 })[0].path).toBe('skinfoldMm');
      expect(parse({ skinfoldMm: 61 })[0].message).toBe('Skinfold must be between 1 and 60 mm');
    });

    it('rejects text where a number belongs, naming the range', () => {
      expect(parse({ kneeFlexionDeg: '90' })).toEqual([
        { path: 'kneeFlexionDeg', message: 'Knee flexion must be a whole number between 0 and 160°' },
      ]);
    });
  });

  describe('paired fields', () => {
    it('points at the other side when only the injured girth is given', () => {
      expect(parse({ girthInjuredCm: 52, girthLandmark: 'Patella', girthDistanceCm: 20 })).toEqual([
        { path: 'girthOtherCm', message: 'Girth must be measured on both sides, or on neither' },
      ]);
    });

    it('points at the injured side when only the other girth is given', () => {
      expect(parse({ girthOtherCm: 50, girthLandmark: 'Patella', girthDistanceCm: 20 }).map((i) => i.path)).toEqual(['girthInjuredCm']);
    });

    it('requires the landmark and distance with a girth', () => {
      expect(parse({ girthInjuredCm: 52, girthOtherCm: 50, girthLandmark: '  ' }).map((i) => i.path)).toEqual([
        'girthLandmark',
        'girthDistanceCm',
      ]);
    });

    it('points at the missing bruise dimension', () => {
      expect(parse({ bruiseLengthCm: 8 })).toEqual([
        { path: 'bruiseWidthCm', message: 'Bruise size needs both length and width, or neither' },
      ]);
      expect(parse({ bruiseWidthCm: 5, bruiseLengthCm: null }).map((i) => i.path)).toEqual(['bruiseLengthCm']);
    });
  });

  it('rejects an empty measurement', () => {
    expect(parse({})).toEqual([{ path: '', message: 'Record at least one measurement or a note' }]);
  });

  it('rejects a measurement time more than a few minutes in the future', () => {
    // 5 minutes of clock skew allowed: a choice of ours
    expect(parse({ painNprs: 3, takenAt: '2025-06-12T12:04:00Z' })).toEqual([]);
    expect(parse({ painNprs: 3, takenAt: '2025-06-12T12:06:00Z' })).toEqual([
      { path: 'takenAt', message: 'Measurement time cannot be in the future' },
    ]);
  });

  it('rejects a time without a zone offset', () => {
    expect(parse({ painNprs: 3, takenAt: '2025-06-12T11:00:00' })[0].path).toBe('takenAt');
  });
});
