import { RouterProvider } from "react-router-dom";
import { AppProviders } from "./providers";
import { router } from "./router";
import { UpdatePrompt } from "./update-prompt";

export function App() {
  return (
    <AppProviders>
      <UpdatePrompt />
      <RouterProvider router={router} />
    </AppProviders>
  );
}
