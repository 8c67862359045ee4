import { createRoot } from "react-dom/client";

// Placeholder until the editor lands.
createRoot(document.getElementById("root")!).render(<h1>Yard Antenna Planner</h1>);
