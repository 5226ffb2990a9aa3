/** Entry of the language server bundle (`dist/server.js`), started by the VS Code client over IPC or stdio. */
import { startStdioOrIpcServer } from './start';

startStdioOrIpcServer();
