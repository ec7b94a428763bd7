/** Entry of the planner page (plain web page and Electron renderer alike). */
import { createApp } from 'vue';
import App from './App.vue';
import './styles/base.css';
import './styles/frame.css';
import './styles/fields.css';
import './styles/legs.css';
import './styles/outcome.css';
import './styles/charts.css';
import './styles/editors.css';
import './styles/views.css';
import './styles/print.css';

createApp(App).mount('#app');
