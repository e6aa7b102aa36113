/** Entry of the playground page: three independent panels over the built library. */
import './style.css';
import { initDesigner } from './designer.js';
import { initNetwork } from './network.js';
import { initSensitivity } from './sensitivity.js';

initDesigner();
initNetwork();
initSensitivity();
document.body.dataset.ready = 'yes';
