// Low-resolution land outlines (Natural Earth 1:110m via world-atlas), bundled: no network needed.
import { feature } from "topojson-client";
import type { GeometryCollection, Topology } from "topojson-specification";
import land110m from "world-atlas/land-110m.json";

const topology = land110m as unknown as Topology<{ land: GeometryCollection }>;

export const landOutlines = feature(topology, topology.objects.land);
