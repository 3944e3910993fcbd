"use client";

// The book on a map (MapLibre GL): each property a marker whose colour, shape and word follow its
// Index band (lib/scoring/bands.ts), with a dark badge when it has open risk alerts and a blue
// ring when it should be checked soon; pressure areas as shaded circles. A click opens a popup
// with the name, the Index and a link to the property. The same list is a table beside the map
// (components/book/book-map-table.tsx) for keyboard and screen-reader users.
import "maplibre-gl/dist/maplibre-gl.css";

import type { Map as MapLibreMap, StyleSpecification } from "maplibre-gl";
import { useEffect, useRef, useState } from "react";

import type { BookMapDto } from "@/lib/book/dto";
import { BOOK_MAP_WORKER_PATH } from "@/lib/paths";
import { alertKindLabel } from "@/lib/risk/labels";
import { circleRing } from "@/lib/risk/pressure-areas";
import { BAND_STYLE, INDEX_BANDS, indexBand, type IndexBand } from "@/lib/scoring/bands";

export interface MapArea {
  key: string;
  kindLabel: string;
  centre: { lat: number; lng: number };
  radiusMi: number;
  propertyCount: number;
}

/** Without a configured map service: the points on a plain background (no outside request). */
const PLAIN_STYLE: StyleSpecification = {
  version: 8,
  sources: {},
  layers: [{ id: "background", type: "background", paint: { "background-color": "#eef0e6" } }],
};
const INK = "#18211b";
const RAIN = "#2a6496";
const CLAY = "#a8321f";
/** The contiguous United States, when there is nothing to fit. */
const US_BOUNDS: [[number, number], [number, number]] = [
  [-124.8, 24.4],
  [-66.9, 49.4],
];

/** A marker image: the band's shape in its colour, white outline, and an alert badge when asked. */
function markerImage(band: IndexBand, alert: boolean, ratio: number): ImageData {
  const size = 28;
  const canvas = document.createElement("canvas");
  canvas.width = size * ratio;
  canvas.height = size * ratio;
  const g = canvas.getContext("2d")!;
  g.scale(ratio, ratio);
  const { color, shape } = BAND_STYLE[band];
  const c = 13;
  g.lineWidth = 2.5;
  g.strokeStyle = "#ffffff";
  g.fillStyle = color;
  g.beginPath();
  if (shape === "circle" || shape === "ring") g.arc(c, c + 1, 8, 0, 2 * Math.PI);
  else if (shape === "diamond") {
    g.moveTo(c, c - 9);
    g.lineTo(c + 9, c + 1);
    g.lineTo(c, c + 11);
    g.lineTo(c - 9, c + 1);
    g.closePath();
  } else g.rect(c - 7.5, c - 6.5, 15, 15);
  g.stroke();
  if (shape === "ring") {
    g.lineWidth = 4;
    g.strokeStyle = color;
    g.stroke();
    g.fillStyle = "#ffffff";
  }
  g.fill();
  if (alert) {
    g.beginPath();
    g.arc(21, 7, 6, 0, 2 * Math.PI);
    g.fillStyle = INK;
    g.fill();
    g.lineWidth = 1.5;
    g.strokeStyle = "#ffffff";
    g.stroke();
    g.fillStyle = "#ffffff";
    g.fillRect(20.1, 3.2, 1.8, 4.6);
    g.fillRect(20.1, 8.8, 1.8, 1.8);
  }
  return g.getImageData(0, 0, canvas.width, canvas.height);
}

export function BookMap({
  data,
  areas,
  styleUrl,
}: {
  data: BookMapDto;
  areas: MapArea[];
  styleUrl: string | null;
}) {
  const container = useRef<HTMLDivElement>(null);
  const [failure, setFailure] = useState<string | null>(null);

  useEffect(() => {
    let map: MapLibreMap | undefined;
    let cancelled = false;
    (async () => {
      const maplibre = await import("maplibre-gl");
      if (cancelled || !container.current) return;
      // The worker script from this origin (app/(office)/book/map/worker/route.ts).
      maplibre.setWorkerUrl(BOOK_MAP_WORKER_PATH);
      const points: GeoJSON.FeatureCollection<GeoJSON.Point> = {
        type: "FeatureCollection",
        features: data.points.map(([id, name, lat, lng, index, alerts, kinds, checkSoon]) => {
          const band = indexBand(index);
          const open = alerts[0] + alerts[1] + alerts[2];
          return {
            type: "Feature",
            id,
            geometry: { type: "Point", coordinates: [lng, lat] },
            properties: {
              id,
              name,
              index,
              band,
              open,
              kinds: kinds.map((k) => alertKindLabel(data.kinds[k] ?? "")).join(", "),
              checkSoon,
              icon: `${band}${open ? "-alert" : ""}`,
            },
          };
        }),
      };
      const areaShapes: GeoJSON.FeatureCollection<GeoJSON.Polygon> = {
        type: "FeatureCollection",
        features: areas.map((a) => ({
          type: "Feature",
          geometry: { type: "Polygon", coordinates: [circleRing(a.centre, a.radiusMi)] },
          properties: { key: a.key, kindLabel: a.kindLabel, count: a.propertyCount },
        })),
      };
      try {
        map = new maplibre.Map({
          container: container.current,
          style: styleUrl ?? PLAIN_STYLE,
          bounds: boundsOf(data, areas) ?? US_BOUNDS,
          fitBoundsOptions: { padding: 40, maxZoom: 14 },
          attributionControl: { compact: true },
          cooperativeGestures: false,
        });
      } catch {
        setFailure(
          "This browser cannot draw the map (WebGL is off). The table lists every property.",
        );
        return;
      }
      const m = map;
      // For tests and tools: the map instance on its element.
      Object.defineProperty(container.current, "swardMap", { value: m, configurable: true });
      m.addControl(new maplibre.NavigationControl({ showCompass: false }), "top-right");
      m.on("error", (e) => {
        if (e.error?.message?.includes("style")) setFailure("The base map could not be loaded.");
      });
      m.on("load", () => {
        const ratio = window.devicePixelRatio || 1;
        for (const band of INDEX_BANDS)
          for (const alert of [false, true])
            m.addImage(`${band}${alert ? "-alert" : ""}`, markerImage(band, alert, ratio), {
              pixelRatio: ratio,
            });
        m.addSource("pressure-areas", { type: "geojson", data: areaShapes });
        m.addLayer({
          id: "pressure-area-fill",
          type: "fill",
          source: "pressure-areas",
          paint: { "fill-color": CLAY, "fill-opacity": 0.14 },
        });
        m.addLayer({
          id: "pressure-area-line",
          type: "line",
          source: "pressure-areas",
          paint: { "line-color": CLAY, "line-width": 2, "line-dasharray": [2, 1.5] },
        });
        m.addSource("properties", { type: "geojson", data: points });
        m.addLayer({
          id: "check-soon",
          type: "circle",
          source: "properties",
          filter: ["==", ["get", "checkSoon"], 1],
          paint: {
            "circle-radius": 15,
            "circle-color": "rgba(0,0,0,0)",
            "circle-stroke-color": RAIN,
            "circle-stroke-width": 3,
          },
        });
        m.addLayer({
          id: "properties",
          type: "symbol",
          source: "properties",
          layout: {
            "icon-image": ["get", "icon"],
            "icon-allow-overlap": true,
            "icon-ignore-placement": true,
          },
        });
        container.current?.setAttribute("data-map-state", "ready");
      });
      m.on("click", "properties", (e) => {
        const f = e.features?.[0];
        if (!f || f.geometry.type !== "Point") return;
        new maplibre.Popup({ maxWidth: "260px" })
          .setLngLat(f.geometry.coordinates as [number, number])
          .setDOMContent(popupContent(f.properties as PopupProps))
          .addTo(m);
      });
      m.on("click", "pressure-area-fill", (e) => {
        if (m.queryRenderedFeatures(e.point, { layers: ["properties"] }).length) return;
        const f = e.features?.[0];
        if (!f) return;
        const p = f.properties as { kindLabel: string; count: number };
        const el = document.createElement("p");
        el.className = "font-semibold";
        el.textContent = `Pressure area: ${p.kindLabel}, ${p.count} ${p.count === 1 ? "property" : "properties"} with alerts`;
        new maplibre.Popup({ maxWidth: "260px" }).setLngLat(e.lngLat).setDOMContent(el).addTo(m);
      });
      for (const layer of ["properties", "pressure-area-fill"]) {
        m.on("mouseenter", layer, () => (m.getCanvas().style.cursor = "pointer"));
        m.on("mouseleave", layer, () => (m.getCanvas().style.cursor = ""));
      }
    })().catch(() => setFailure("The map could not be started. The table lists every property."));
    return () => {
      cancelled = true;
      map?.remove();
    };
  }, [data, areas, styleUrl]);

  return (
    <div className="relative">
      <div
        ref={container}
        data-book-map=""
        data-map-state="loading"
        className="h-[60vh] min-h-80 w-full overflow-hidden rounded-xl border border-line bg-[#eef0e6]"
        role="region"
        aria-label="Map of the book (the table below lists the same properties)"
      />
      {failure ? (
        <p role="status" className="mt-2 font-semibold text-clay">
          {failure}
        </p>
      ) : null}
    </div>
  );
}

interface PopupProps {
  id: string;
  name: string;
  index: number | null;
  band: IndexBand;
  open: number;
  kinds: string;
  checkSoon: 0 | 1;
}

/** The popup as DOM nodes (text only: a property name is never read as markup). */
function popupContent(p: PopupProps): HTMLElement {
  const root = document.createElement("div");
  root.className = "space-y-1 text-ink";
  const name = document.createElement("p");
  name.className = "font-bold";
  name.textContent = p.name;
  const index = document.createElement("p");
  const style = BAND_STYLE[p.band];
  index.textContent =
    p.index === null || p.index === undefined
      ? "Sward Index: not rated yet"
      : `Sward Index ${p.index} (${style.word.toLowerCase()})`;
  root.append(name, index);
  if (p.open) {
    const alerts = document.createElement("p");
    alerts.textContent = `${p.open} open risk ${p.open === 1 ? "alert" : "alerts"}: ${p.kinds}`;
    root.append(alerts);
  }
  if (Number(p.checkSoon) === 1) {
    const soon = document.createElement("p");
    soon.className = "font-semibold text-rain";
    soon.textContent = "Check soon: inside a pressure area, no recent visit";
    root.append(soon);
  }
  const link = document.createElement("a");
  link.href = `/properties/${encodeURIComponent(p.id)}`;
  link.className = "font-semibold text-sward underline";
  link.textContent = "Open the property";
  root.append(link);
  return root;
}

function boundsOf(data: BookMapDto, areas: MapArea[]): [[number, number], [number, number]] | null {
  const lats = data.points.map((p) => p[2]).concat(areas.map((a) => a.centre.lat));
  const lngs = data.points.map((p) => p[3]).concat(areas.map((a) => a.centre.lng));
  if (!lats.length) return null;
  const pad = 0.005;
  return [
    [Math.min(...lngs) - pad, Math.min(...lats) - pad],
    [Math.max(...lngs) + pad, Math.max(...lats) + pad],
  ];
}
