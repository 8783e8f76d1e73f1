/** Entry of the workbench page: connect to whichever host is there and draw the app. */
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { connectHost } from './host-client';
import './styles.css';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App host={connectHost()} />
  </StrictMode>,
);
