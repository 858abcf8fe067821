// How each tender state looks in its pill: its own colour and its own shape, so that the states
// read apart in grey-scale print and for people who do not tell the colours apart. The shape is a
// small dial that fills as the tender moves on (a quarter per stage from open to awarded); a draft
// has a dashed outline and an empty dial, a cancelled tender a struck-through dial.
import type { TenderState } from "@/policies/vocabulary";

export interface StateLook {
  label: string;
  /** How much of the dial is filled: 0 (nothing) to 1 (full). */
  fill: number;
  /** A draft's outline is dashed; a cancelled tender's dial is struck through. */
  outline: "solid" | "dashed";
  struck: boolean;
  /** Text and dial colour, background and border (each text colour reads at 4.5:1 or more on its background). */
  ink: string;
  ground: string;
  edge: string;
}

export const STATE_LOOK: Record<TenderState, StateLook> = {
  draft: { label: "Draft", fill: 0, outline: "dashed", struck: false, ink: "#3f4a5a", ground: "#f1f3f6", edge: "#8a94a6" },
  open: { label: "Open for offers", fill: 0, outline: "solid", struck: false, ink: "#0a434c", ground: "#dff0f2", edge: "#0f5e6b" },
  technical: { label: "Technical evaluation", fill: 0.25, outline: "solid", struck: false, ink: "#1f3f86", ground: "#e6ecfa", edge: "#3a5db8" },
  commercial: { label: "Commercial evaluation", fill: 0.5, outline: "solid", struck: false, ink: "#58287f", ground: "#f1e9f8", edge: "#8052a8" },
  approval: { label: "In approval", fill: 0.75, outline: "solid", struck: false, ink: "#6e3d00", ground: "#fcefdc", edge: "#b26a00" },
  awarded: { label: "Awarded", fill: 1, outline: "solid", struck: false, ink: "#155a2a", ground: "#e1f2e6", edge: "#1f7a3a" },
  cancelled: { label: "Cancelled", fill: 0, outline: "solid", struck: true, ink: "#85190f", ground: "#fae6e3", edge: "#b42318" },
};
