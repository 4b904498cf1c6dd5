// The demo campaign's checklist templates: invented for the demo, written from common practice
// for transporting and starting an optical clock. Cautions defer to local rules and the site's
// safety officer; they do not make a step safe.
import type { z } from "zod";
import type { checklistItem, ChecklistPurpose } from "../../shared/schemas/checklists";

type Item = z.input<typeof checklistItem>;

export interface DemoTemplate {
  title: string;
  purpose: ChecklistPurpose;
  items: Item[];
}

const deferTo = "Follow local regulations and the site's safety officer.";

export const demoChecklists: DemoTemplate[] = [
  {
    title: "Arrival at the site",
    purpose: "arrival",
    items: [
      { kind: "check", id: "site-access", label: "Access road and door are clear for the crates" },
      {
        kind: "check",
        id: "weather",
        label: "Weather checked for the next 24 hours",
        caution: {
          hazard: "weather",
          text: `Conditions above the tree line and on exposed coasts change fast; postpone moves in storm or ice. ${deferTo}`,
        },
      },
      {
        kind: "number",
        id: "room-temp",
        label: "Room temperature at the clock's place",
        unit: "°C",
        min: 18,
        max: 26,
      },
      {
        kind: "number",
        id: "room-rh",
        label: "Room relative humidity",
        unit: "%",
        min: 20,
        max: 60,
      },
      {
        kind: "choice",
        id: "mains",
        label: "Mains power at the site",
        options: ["Stable", "Unstable", "None: generator"],
      },
      { kind: "number", id: "crate-count", label: "Crates delivered", unit: "", min: 1, max: null },
      { kind: "photo", id: "arrival-photo", label: "Photo of the crates as delivered" },
      { kind: "text", id: "arrival-notes", label: "Anything unusual", required: false },
    ],
  },
  {
    title: "Unpacking the crates",
    purpose: "unpacking",
    items: [
      {
        kind: "check",
        id: "dew-point-ok",
        label: "Crate surfaces are warmer than the room's dew point",
        help: "Opening a cold crate in warm, humid air fogs the optics with condensation.",
      },
      {
        kind: "check",
        id: "shock-indicators",
        label: "Shock indicators read and recorded for every crate",
      },
      {
        kind: "check",
        id: "lift-team",
        label: "Two people or a lifting aid for each crate over 25 kg",
        caution: {
          hazard: "lifting",
          text: `Lift with a straight back, with enough people or a hoist; keep feet clear under the crate. ${deferTo}`,
        },
      },
      { kind: "photo", id: "opened-photo", label: "Photo of the opened physics package crate" },
      { kind: "text", id: "damage", label: "Visible damage", required: false },
    ],
  },
  {
    title: "Vacuum and bake-out",
    purpose: "vacuum-bakeout",
    items: [
      {
        kind: "number",
        id: "pressure",
        label: "Pressure in the vacuum chamber",
        unit: "mbar",
        min: null,
        max: 1e-8,
      },
      {
        kind: "number",
        id: "bake-temp",
        label: "Bake-out temperature",
        unit: "°C",
        min: null,
        max: 150,
        caution: {
          hazard: "hot-surface",
          text: `Baked parts stay hot for hours: wear heat-resistant gloves and mark the area. ${deferTo}`,
        },
      },
      {
        kind: "check",
        id: "ion-pump",
        label: "Ion pump supply connected and interlocked",
        caution: {
          hazard: "high-voltage",
          text: `Ion pump supplies carry several kilovolts: switch off and wait before touching cables. ${deferTo}`,
        },
      },
    ],
  },
  {
    title: "Lasers and lock-up",
    purpose: "laser-lockup",
    items: [
      {
        kind: "check",
        id: "laser-area",
        label: "Laser area marked and eyewear for the wavelengths in use at the door",
        caution: {
          hazard: "laser",
          text: `Invisible beams can harm the eyes: wear the rated eyewear and keep beams below eye level. ${deferTo}`,
        },
      },
      {
        kind: "number",
        id: "cavity-temp",
        label: "Reference cavity temperature",
        unit: "°C",
        min: 20,
        max: 30,
      },
      { kind: "check", id: "lock", label: "Clock laser locked to the cavity" },
      {
        kind: "choice",
        id: "comb",
        label: "Frequency comb",
        options: ["Locked", "Not locked", "Not used"],
      },
    ],
  },
  {
    title: "Start of the comparison",
    purpose: "comparison-start",
    items: [
      { kind: "check", id: "link-up", label: "Link to the reference clock is up" },
      { kind: "check", id: "data-logging", label: "Data logging started and timestamps in UTC" },
      {
        kind: "number",
        id: "uptime-target",
        label: "Planned uptime",
        unit: "%",
        min: 0,
        max: 100,
      },
      { kind: "text", id: "start-notes", label: "Notes for the geodesist", required: false },
    ],
  },
  {
    title: "Packing down",
    purpose: "pack-down",
    items: [
      { kind: "check", id: "power-down", label: "Systems powered down in the documented order" },
      {
        kind: "check",
        id: "batteries",
        label: "Lithium batteries packed for transport with terminals covered",
        caution: {
          hazard: "battery",
          text: `Damaged lithium batteries can catch fire: never pack a swollen or dented one, and follow the carrier's dangerous-goods rules. ${deferTo}`,
        },
      },
      {
        kind: "check",
        id: "indicators-new",
        label: "Fresh shock indicators fitted to every crate",
      },
      {
        kind: "check",
        id: "lift-out",
        label: "Crates lifted out with enough people or a lifting aid",
        caution: {
          hazard: "lifting",
          text: `Lift with a straight back, with enough people or a hoist; keep feet clear under the crate. ${deferTo}`,
        },
      },
      { kind: "photo", id: "packed-photo", label: "Photo of the packed crates" },
    ],
  },
];
