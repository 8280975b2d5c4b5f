import { mountApp } from './ui';

const root = document.getElementById('app');
if (!root) throw new Error('index.html has no #app element');
mountApp(root);
