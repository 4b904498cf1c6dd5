import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import "./styles/index.css";
import { App } from "./app/app";
import { startAppearance } from "./lib/appearance";
import { resumeSession } from "./lib/session";

startAppearance();
// A remembered session opens the app at once; the server confirms it when it can.
void resumeSession();
window.addEventListener("online", () => void resumeSession());

const root = document.getElementById("root");
if (root === null) throw new Error("index.html has no #root element");
createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
