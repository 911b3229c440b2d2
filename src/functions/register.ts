/**
 * Entry of the `functions` bundle, loaded by taskpane.html in the shared
 * runtime. Importing functions.ts registers the LOOM functions (the build
 * appends their `CustomFunctions.associate` calls to it); starting the host
 * binds the open workbook, whose saved models the functions read.
 */
import './functions';
import { logHostError } from '../host/host-detect';
import { startHost } from '../host/start-host';

startHost().catch(logHostError);
