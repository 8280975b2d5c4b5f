import { mountApp } from './ui';

const root = document.getElementById('app');
if (!root) throw new Error('index.html has no #app element');
void mountApp(root);
