import { Notice } from "../../../components/notice";

/** Levelling puts people on roads and slopes, often in changing mountain weather. */
export function LevellingCaution() {
  return (
    <Notice tone="attention" title="Caution: roads, slopes and mountain weather">
      Staff holders on a road need traffic control as local rules require; on slopes keep footing
      and keep the staff clear of overhead lines. Stop when a storm or lightning approaches or
      visibility drops. Local rules and the site&apos;s safety officer decide; this reminder does
      not replace them.
    </Notice>
  );
}
