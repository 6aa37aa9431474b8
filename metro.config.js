// Metro: keep server code out of the app bundles. (Web fonts are not bundled: the root HTML
// declares them and the web build copies the files, lib/web-fonts.ts.)
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
const root = __dirname.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
config.resolver.blockList = [
  new RegExp(`^${root}${path.sep === '\\' ? '\\\\' : '/'}(api|bench|migrations|scripts|tests|dist|\\.data)/.*`),
];
module.exports = config;
