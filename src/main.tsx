import './csp.ts'; // before anything builds a zod schema
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './ui/App.tsx';
import { SavedWorkProvider } from './ui/saved/SavedWorkProvider.tsx';
import './ui/styles.css';

const root = document.getElementById('root');
if (root) createRoot(root).render(<StrictMode><SavedWorkProvider><App /></SavedWorkProvider></StrictMode>);
