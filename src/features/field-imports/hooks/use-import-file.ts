// The file being imported: read with progress, its header sniffed, the mapping guessed (or recalled
// for the logger model), then parsed again on every mapping change. A newer run supersedes an older
// one, so a slow parse never overwrites the result of a later change.
import { useCallback, useRef, useState } from "react";
import { recallMapping } from "../mapping-memory";
import { guessMapping, headersAt, sniff } from "../parse/guess";
import { mappedColumns, type ColumnMapping, type ImportKind } from "../parse/mapping";
import { parseLoggerText, type ParsedFile } from "../parse/parse-csv";
import { readFileText } from "../parse/read-file";
import type { ImportProgress } from "../components/import-parts";

const sniffChars = 64 * 1024;

export interface LoadedFile {
  name: string;
  text: string;
}

export interface ImportFileState {
  file: LoadedFile | null;
  headers: string[];
  mapping: ColumnMapping | null;
  parsed: ParsedFile | null;
  progress: ImportProgress | null;
  /** A problem reading the file itself (too large, unreadable). */
  readError: string | null;
}

const initial: ImportFileState = {
  file: null,
  headers: [],
  mapping: null,
  parsed: null,
  progress: null,
  readError: null,
};

const deviceOffsetMinutes = () => -new Date().getTimezoneOffset();

/** A remembered mapping is used only when this file has the columns it names. */
function fits(mapping: ColumnMapping | null, text: string): mapping is ColumnMapping {
  if (mapping === null) return false;
  const headers = headersAt(text.slice(0, sniffChars), mapping.headerLine, mapping.delimiter);
  return mappedColumns(mapping).every(({ name }) => headers.includes(name));
}

export function useImportFile(kind: ImportKind) {
  const [state, setState] = useState<ImportFileState>(initial);
  const run = useRef(0);

  const parse = useCallback(async (file: LoadedFile, mapping: ColumnMapping) => {
    const mine = ++run.current;
    const headers = headersAt(
      file.text.slice(0, sniffChars),
      mapping.headerLine,
      mapping.delimiter,
    );
    setState((s) => ({
      ...s,
      file,
      headers,
      mapping,
      parsed: null,
      progress: { label: "Checking the readings…", fraction: 0 },
    }));
    const parsed = await parseLoggerText(file.text, mapping, (p) => {
      if (run.current === mine)
        setState((s) => ({
          ...s,
          progress: { label: "Checking the readings…", fraction: p.doneChars / p.totalChars },
        }));
    });
    if (run.current === mine) setState((s) => ({ ...s, parsed, progress: null }));
  }, []);

  const pick = useCallback(
    async (picked: File | null, loggerModel: string) => {
      const mine = ++run.current;
      if (picked === null) {
        setState(initial);
        return;
      }
      setState({ ...initial, progress: { label: `Reading ${picked.name}…`, fraction: 0 } });
      try {
        const text = await readFileText(picked, (p) => {
          if (run.current === mine)
            setState((s) => ({
              ...s,
              progress: { label: `Reading ${picked.name}…`, fraction: p.doneBytes / p.totalBytes },
            }));
        });
        if (run.current !== mine) return;
        const remembered = recallMapping(kind, loggerModel);
        const mapping = fits(remembered, text)
          ? remembered
          : guessMapping(kind, sniff(text.slice(0, sniffChars)), deviceOffsetMinutes());
        await parse({ name: picked.name, text }, mapping);
      } catch (error) {
        if (run.current === mine)
          setState({
            ...initial,
            readError: error instanceof Error ? error.message : "The file could not be read",
          });
      }
    },
    [kind, parse],
  );

  /** The logger model changed: its remembered mapping, when it fits this file, replaces the form. */
  const applyModel = useCallback(
    (loggerModel: string) => {
      const remembered = recallMapping(kind, loggerModel);
      if (state.file !== null && fits(remembered, state.file.text))
        void parse(state.file, remembered);
    },
    [kind, parse, state.file],
  );

  const changeMapping = useCallback(
    (mapping: ColumnMapping) => {
      if (state.file !== null) void parse(state.file, mapping);
    },
    [parse, state.file],
  );

  return { state, pick, changeMapping, applyModel };
}
