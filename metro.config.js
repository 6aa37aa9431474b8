// Metro for the web build: ship font files (woff/woff2) as assets, keep server code out.
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
config.resolver.assetExts.push('woff', 'woff2');
const root = __dirname.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
config.resolver.blockList = [
  new RegExp(`^${root}${path.sep === '\\' ? '\\\\' : '/'}(api|bench|migrations|scripts|tests|dist|\\.data)/.*`),
];
module.exports = config;
