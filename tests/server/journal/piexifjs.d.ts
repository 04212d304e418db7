// piexifjs ships no types; only what the journal tests use. It works on "binary strings" (one char per byte).
declare module 'piexifjs' {
  type IfdValue = number | string | number[] | Array<[number, number]> | [number, number];
  interface ExifDict {
    '0th'?: Record<number, IfdValue>;
    Exif?: Record<number, IfdValue>;
    GPS?: Record<number, IfdValue>;
    '1st'?: Record<number, IfdValue>;
    thumbnail?: string | null;
  }
  const piexif: {
    dump(exif: ExifDict): string;
    insert(exif: string, jpeg: string): string;
    load(jpeg: string): ExifDict;
    ImageIFD: Record<string, number>;
    GPSIFD: Record<string, number>;
    GPSHelper: { degToDmsRational(deg: number): Array<[number, number]> };
  };
  export default piexif;
}
